// Segment the open image with seed strokes from the ROI Manager, then save the mask, the label
// image and the measurements next to the image.
//
// Seeds: line (or area) ROIs in the ROI Manager whose names start with "foreground" (or "fg") and
// "background" (or "bg"); on a z-stack each ROI must have its slice position. Draw them with the
// line tools and rename them in the ROI Manager, or save the strokes of the seed brush (Save seeds)
// and open that zip here.
//
// Use: open the image (or pass "image=PATH seeds=ROIS.zip" as the macro argument, as the tests do),
// then run this macro. Change the settings in the run(...) line; every key is the first word of a
// field of Plugins > Cleave > Segment Current Image... (record the command once to see them all).
// A problem ends the macro with one line in the Log, never with a dialog.
// Cleave is a research tool, not a diagnostic device: validate segmentations against expert
// annotation.

arg = getArgument();
image = parse(arg, "image");
rois = parse(arg, "seeds");
if (image != "") open(image);
if (nImages == 0) exit("Open an image first.");
title = getTitle();
dir = getDirectory("image");
base = File.getNameWithoutExtension(title);
if (rois != "") {
  roiManager("reset");
  roiManager("Open", rois);
}
run("Segment Current Image...", "seeds=[ROI Manager] boundary=2 contrast=auto neighborhood=auto likelihood=auto refine=3 illumination=auto flatten=50 holes=fill split=shape min=0");
selectImage(base + ".mask");
saveAs("Tiff", dir + base + ".mask.tif");
selectImage(base + ".labels");
saveAs("Tiff", dir + base + ".labels.tif");
saveAs("Results", dir + base + ".objects.csv");
print("Cleave macro done: " + dir + base + ".mask.tif");

// The value of "key=value" in a macro argument, or "".
function parse(text, key) {
  words = split(text, " ");
  for (i = 0; i < words.length; i++) {
    if (startsWith(words[i], key + "=")) return substring(words[i], lengthOf(key) + 1);
  }
  return "";
}
