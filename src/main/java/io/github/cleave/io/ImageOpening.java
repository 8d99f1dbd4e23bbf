package io.github.cleave.io;

import ij.ImagePlus;
import ij.io.FileInfo;
import ij.io.Opener;
import io.github.cleave.image.BadInputException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Iterator;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import javax.imageio.ImageIO;
import javax.imageio.ImageReader;
import javax.imageio.stream.ImageInputStream;

/**
 * Opens an image file with ImageJ's own readers, headless and without dialogs, after checking
 * everything that can be checked from the file's header: that it exists and is not empty, that a
 * TIFF's header can be decoded and its pixel data lies within the file (a truncated file is refused
 * instead of being read with zeros), that it is not a time-lapse, and that it fits in the heap
 * ({@link MemoryEstimate}). Accepted: TIFF ({@code .tif}, {@code .tiff}), PNG, and a TIFF inside a
 * {@code .zip} (for those only the checks after reading apply). Every failure is a {@link
 * BadInputException} naming the file. {@link #openForSeries} makes the same checks of the file for
 * a time-lapse, opening a TIFF virtually and leaving the time points and the memory check to the
 * caller.
 */
final class ImageOpening {
  private static final Pattern FRAMES = Pattern.compile("(?m)^frames=(\\d+)");
  private static final Pattern CHANNELS = Pattern.compile("(?m)^channels=(\\d+)");

  private ImageOpening() {}

  /** Opens {@code file}; {@code role} ("image", "seed image") starts the messages. */
  static ImagePlus open(Path file, String role) {
    long length = checkFile(file, role);
    if (isTiff(file)) {
      FileInfo[] infos = tiffInfos(file, role, length);
      FileInfo first = infos[0];
      String description = first.description == null ? "" : first.description;
      checkTimePoints(file.toString(), role, intIn(FRAMES, description, 1));
      long needed = tiffBytesNeeded(infos);
      MemoryEstimate.check(
          file.toString(),
          first.width + " x " + first.height + " x " + planeCount(infos) + " planes",
          needed,
          MemoryEstimate.availableFor(needed));
    } else if (isPng(file)) {
      checkPngHeader(file, role);
    }
    ImagePlus imp = openWithImageJ(file, role);
    checkTimePoints(file.toString(), role, imp.getNFrames());
    return imp;
  }

  /**
   * Opens {@code file} as a time-lapse may be opened: the same checks of the file as {@link #open},
   * but no refusal of time points and no memory check of the whole file (the caller checks per time
   * point). A TIFF is opened virtually: only its first plane is read now, every other plane when
   * its stack asks for it ({@link VirtualTiffs}); a PNG or a zipped TIFF is read whole.
   */
  static ImagePlus openForSeries(Path file, String role) {
    long length = checkFile(file, role);
    if (isTiff(file)) {
      FileInfo[] infos = tiffInfos(file, role, length);
      ImagePlus imp;
      try {
        imp = VirtualTiffs.open(file, infos);
      } catch (RuntimeException | LinkageError e) {
        throw new BadInputException(
            role + " file " + file + " is not a readable TIFF (corrupt or unsupported): " + e, e);
      }
      if (imp == null) {
        return openWithImageJ(file, role);
      }
      if (imp.getStackSize() < 1 || imp.getProcessor() == null) {
        throw new BadInputException(
            role + " file " + file + " is not a readable TIFF (corrupt, truncated or unsupported)");
      }
      return imp;
    }
    if (isPng(file)) {
      checkPngHeader(file, role);
    }
    return openWithImageJ(file, role);
  }

  /** Checks that {@code file} exists, is a non-empty file of a known type; returns its length. */
  private static long checkFile(Path file, String role) {
    String name = file.toString();
    if (!Files.exists(file)) {
      throw new BadInputException(role + " file " + name + " does not exist");
    }
    if (Files.isDirectory(file)) {
      throw new BadInputException(role + " " + name + " is a folder; expected a TIFF or PNG file");
    }
    long length;
    try {
      length = Files.size(file);
    } catch (IOException e) {
      throw new BadInputException(role + " file " + name + " cannot be read: " + e, e);
    }
    if (length == 0) {
      throw new BadInputException(
          role + " file " + name + " is empty (0 bytes); expected a TIFF or PNG image");
    }
    String lower = file.getFileName().toString().toLowerCase(Locale.ROOT);
    if (!isTiff(file) && !isPng(file) && !lower.endsWith(".zip")) {
      throw new BadInputException(
          role
              + " file "
              + name
              + " has an unsupported type; Cleave reads TIFF (.tif, .tiff), PNG (.png) and a TIFF"
              + " zipped by ImageJ (.zip)");
    }
    return length;
  }

  static boolean isTiff(Path file) {
    String lower = file.getFileName().toString().toLowerCase(Locale.ROOT);
    return lower.endsWith(".tif") || lower.endsWith(".tiff");
  }

  private static boolean isPng(Path file) {
    return file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".png");
  }

  private static ImagePlus openWithImageJ(Path file, String role) {
    String name = file.toString();
    ImagePlus imp;
    try {
      Opener opener = new Opener();
      opener.setSilentMode(true);
      imp = opener.openImage(file.toAbsolutePath().toString());
    } catch (OutOfMemoryError e) {
      throw new BadInputException(
          role + " " + name + " is too large for the heap; start Java with a larger -Xmx", e);
    } catch (RuntimeException | LinkageError e) {
      throw new BadInputException(
          role + " file " + name + " is not a readable image (corrupt or unsupported): " + e, e);
    }
    if (imp == null || imp.getStackSize() < 1 || imp.getProcessor() == null) {
      throw new BadInputException(
          role
              + " file "
              + name
              + " is not a readable image (corrupt, truncated or not a TIFF/PNG file)");
    }
    return imp;
  }

  static void checkTimePoints(String name, String role, int frames) {
    if (frames > 1) {
      throw new BadInputException(
          role
              + " "
              + name
              + " has "
              + frames
              + " time points; open it as a time-lapse, which segments one time point at a"
              + " time, or save each time point as its own file");
    }
  }

  /**
   * The image entries of a TIFF's header, after checking that they can be decoded and that their
   * pixel data lies within the file (a truncated file is refused instead of being read as zeros).
   */
  private static FileInfo[] tiffInfos(Path file, String role, long length) {
    String name = file.toString();
    FileInfo[] infos;
    try {
      infos = Opener.getTiffFileInfo(file.toAbsolutePath().toString());
    } catch (RuntimeException | LinkageError e) {
      infos = null;
    }
    if (infos == null || infos.length == 0 || infos[0].width < 1 || infos[0].height < 1) {
      throw new BadInputException(
          role + " file " + name + " is not a readable TIFF (corrupt, or not a TIFF file)");
    }
    for (FileInfo fi : infos) {
      long end = dataEnd(fi);
      if (end > length) {
        throw new BadInputException(
            String.format(
                Locale.ROOT,
                "%s file %s is truncated: its pixel data ends at byte %d but the file has only %d"
                    + " bytes; save or copy it again",
                role,
                name,
                end,
                length));
      }
    }
    return infos;
  }

  private static long planeCount(FileInfo[] infos) {
    long planes = 0;
    for (FileInfo fi : infos) {
      planes += Math.max(1, fi.nImages);
    }
    return planes;
  }

  /** The heap estimate of a TIFF from its image entries ({@link MemoryEstimate}). */
  private static long tiffBytesNeeded(FileInfo[] infos) {
    long planes = planeCount(infos);
    FileInfo first = infos[0];
    String description = first.description == null ? "" : first.description;
    int channels = intIn(CHANNELS, description, 1);
    int samples = first.samplesPerPixel >= 3 ? 3 : 1;
    return MemoryEstimate.bytesNeeded(
        first.width,
        first.height,
        planes,
        channels,
        Math.max(1, first.getBytesPerPixel()),
        samples);
  }

  /**
   * The heap {@link #open} and a segmentation of the image will need, from the file's header only,
   * or -1 when the header cannot tell (a zip, an unreadable or unknown file: opening it then fails
   * or checks after reading).
   */
  static long bytesNeeded(Path file) {
    String lower = file.getFileName().toString().toLowerCase(Locale.ROOT);
    try {
      if (!Files.isRegularFile(file) || Files.size(file) == 0) {
        return -1;
      }
      if (lower.endsWith(".tif") || lower.endsWith(".tiff")) {
        FileInfo[] infos = Opener.getTiffFileInfo(file.toAbsolutePath().toString());
        if (infos == null || infos.length == 0 || infos[0].width < 1 || infos[0].height < 1) {
          return -1;
        }
        return tiffBytesNeeded(infos);
      }
      if (lower.endsWith(".png")) {
        int[] size = pngSize(file);
        return MemoryEstimate.bytesNeeded(size[0], size[1], 1, 1, 4, 3);
      }
    } catch (IOException | RuntimeException | LinkageError e) {
      return -1;
    }
    return -1;
  }

  /** End of the last pixel byte an uncompressed or stripped TIFF image entry refers to. */
  private static long dataEnd(FileInfo fi) {
    long end = 0;
    if (fi.stripOffsets != null && fi.stripLengths != null) {
      for (int i = 0; i < Math.min(fi.stripOffsets.length, fi.stripLengths.length); i++) {
        end =
            Math.max(end, (fi.stripOffsets[i] & 0xffffffffL) + (fi.stripLengths[i] & 0xffffffffL));
      }
    }
    if (fi.compression <= FileInfo.COMPRESSION_NONE && fi.getBytesPerPixel() > 0) {
      long images = Math.max(1, fi.nImages);
      long gap = Math.max(fi.longGap, fi.gapBetweenImages);
      long imageBytes = (long) fi.width * fi.height * fi.getBytesPerPixel();
      end = Math.max(end, fi.getOffset() + images * imageBytes + (images - 1) * gap);
    }
    return end;
  }

  private static void checkPngHeader(Path file, String role) {
    String name = file.toString();
    int width;
    int height;
    try {
      int[] size = pngSize(file);
      width = size[0];
      height = size[1];
    } catch (IOException | RuntimeException e) {
      throw new BadInputException(
          role + " file " + name + " is not a readable PNG (corrupt, or not a PNG file)", e);
    }
    // Worst case: ImageJ keeps colour PNGs as 4-byte RGB pixels.
    long needed = MemoryEstimate.bytesNeeded(width, height, 1, 1, 4, 3);
    MemoryEstimate.check(name, width + " x " + height, needed, MemoryEstimate.availableFor(needed));
  }

  /** Width and height from a PNG's header. */
  private static int[] pngSize(Path file) throws IOException {
    try (ImageInputStream in = ImageIO.createImageInputStream(file.toFile())) {
      Iterator<ImageReader> readers = in == null ? null : ImageIO.getImageReaders(in);
      if (readers == null || !readers.hasNext()) {
        throw new IOException("no PNG signature");
      }
      ImageReader reader = readers.next();
      try {
        reader.setInput(in);
        return new int[] {reader.getWidth(0), reader.getHeight(0)};
      } finally {
        reader.dispose();
      }
    }
  }

  private static int intIn(Pattern pattern, String text, int fallback) {
    Matcher m = pattern.matcher(text);
    if (!m.find()) {
      return fallback;
    }
    try {
      return Integer.parseInt(m.group(1));
    } catch (NumberFormatException e) {
      return fallback;
    }
  }
}
