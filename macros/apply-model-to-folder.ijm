// Apply a saved model to every TIFF or PNG image of a folder, one image at a time, and save each
// image's mask and measurements into an output folder. For large folders prefer
// Plugins > Cleave > Segment Folder... (one line, parallel, resumable, with a contact sheet):
//   run("Segment Folder...", "model=[/path/model.json] input=[/path/images] output=[/path/results] threads=2");
//
// The model is a JSON file saved by the seed brush (Save model), by Segment Current Image...
// (save=PATH) or by the command line's "learn". Use: run the macro and choose the model and the
// two folders, or pass "model=PATH input=FOLDER output=FOLDER" as the macro argument (no spaces in
// the paths then). Images run in batch mode (no windows). A problem (for example an image with other
// channels than the model's) ends the macro with one line in the Log, never with a dialog. Cleave is
// a research tool, not a diagnostic device: validate segmentations against expert annotation.

arg = getArgument();
model = parse(arg, "model");
input = parse(arg, "input");
output = parse(arg, "output");
if (model == "") model = File.openDialog("Model file (JSON)");
if (input == "") input = getDirectory("Folder of images");
if (output == "") output = getDirectory("Folder for the results");
if (!endsWith(input, File.separator)) input = input + File.separator;
if (!endsWith(output, File.separator)) output = output + File.separator;
setBatchMode(true);
files = getFileList(input);
count = 0;
for (i = 0; i < files.length; i++) {
  name = files[i];
  lower = toLowerCase(name);
  if (!(endsWith(lower, ".tif") || endsWith(lower, ".tiff") || endsWith(lower, ".png"))) continue;
  open(input + name);
  base = File.getNameWithoutExtension(name);
  run("Apply Model...", "model=[" + model + "] seeds=none");
  selectImage(base + ".mask");
  saveAs("Tiff", output + base + ".mask.tif");
  saveAs("Results", output + base + ".objects.csv");
  close("*");
  count++;
}
setBatchMode(false);
print("Cleave macro done: " + count + " image(s) into " + output);

// The value of "key=value" in a macro argument, or "".
function parse(text, key) {
  words = split(text, " ");
  for (i = 0; i < words.length; i++) {
    if (startsWith(words[i], key + "=")) return substring(words[i], lengthOf(key) + 1);
  }
  return "";
}
