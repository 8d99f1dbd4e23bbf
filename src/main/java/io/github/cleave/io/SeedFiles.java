package io.github.cleave.io;

import ij.ImagePlus;
import ij.ImageStack;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.SeedLabels;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Reads seeds for an image of known size from a seed label image or an ImageJ ROI zip, and finds
 * the seed file that belongs to an image.
 *
 * <p><b>Seed label images</b> ({@code .tif}, {@code .tiff}, {@code .png}; DESIGN.md contract): 8-
 * or 16-bit grey, 0 = no seed, 1 = foreground, 2 = background, 3.. further classes, at most {@value
 * SeedLabels#MAX_CLASS}. Raw stored values are used (no lookup table, so an indexed-colour PNG is
 * read by its palette indices). The label image must have the image's width and height and exactly
 * as many planes as the image has z slices.
 *
 * <p><b>ROI zips</b> ({@code .zip}): see {@link RoiSeeds} for the naming convention that gives each
 * ROI its class, how lines and areas are rasterised, the plane a ROI marks, and overlaps.
 *
 * <p>Every problem is a {@link BadInputException} naming the file. Stateless, thread-safe.
 */
public final class SeedFiles {
  /** File name endings searched by {@link #find}, in this order. */
  public static final List<String> SUFFIXES = List.of(".seeds.tif", ".seeds.png", ".seeds.zip");

  private SeedFiles() {}

  /**
   * Reads the seeds in {@code file} for an image of {@code width x height x depth} voxels.
   *
   * @throws BadInputException if the file is missing, unreadable, of the wrong size, or holds a
   *     value or ROI that is not a seed class
   */
  public static SeedLabels read(Path file, int width, int height, int depth) {
    if (width < 1 || height < 1 || depth < 1) {
      throw new IllegalArgumentException(
          "image size " + width + " x " + height + " x " + depth + ": must be positive");
    }
    String lower = file.getFileName().toString().toLowerCase(Locale.ROOT);
    if (lower.endsWith(".zip")) {
      return RoiSeeds.read(file, width, height, depth);
    }
    return readLabelImage(file, width, height, depth);
  }

  private static SeedLabels readLabelImage(Path file, int width, int height, int depth) {
    ImagePlus imp = ImageOpening.open(file, "seed image");
    String name = file.toString();
    int bits = imp.getBitDepth();
    if (bits != 8 && bits != 16) {
      throw new BadInputException(
          "seed image "
              + name
              + " is "
              + (bits == 24 ? "RGB" : bits + "-bit")
              + "; save seed labels as an 8- or 16-bit grey image with 0 = none, 1 = foreground,"
              + " 2 = background, 3.. further classes");
    }
    int planes = imp.getStackSize();
    if (imp.getWidth() != width || imp.getHeight() != height || planes != depth) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "seed image %s is %d x %d x %d (width x height x planes) but the image is %d x %d x"
                  + " %d; the seed label image must have the same size",
              name,
              imp.getWidth(),
              imp.getHeight(),
              planes,
              width,
              height,
              depth));
    }
    int plane = width * height;
    byte[] labels = new byte[plane * depth];
    ImageStack stack = imp.getStack();
    for (int z = 0; z < depth; z++) {
      Object pixels = stack.getPixels(z + 1);
      for (int i = 0; i < plane; i++) {
        int v = pixels instanceof byte[] b ? b[i] & 0xff : ((short[]) pixels)[i] & 0xffff;
        if (v > SeedLabels.MAX_CLASS) {
          throw new BadInputException(
              String.format(
                  Locale.ROOT,
                  "seed image %s has value %d at x=%d, y=%d, z=%d; seed labels are 0..%d (0 none, 1"
                      + " foreground, 2 background, 3.. further classes)",
                  name,
                  v,
                  i % width,
                  i / width,
                  z,
                  SeedLabels.MAX_CLASS));
        }
        labels[z * plane + i] = (byte) v;
      }
    }
    return new SeedLabels(width, height, depth, labels);
  }

  /**
   * The seed file of {@code image}: {@code NAME.seeds.tif}, {@code NAME.seeds.png} or {@code
   * NAME.seeds.zip}, where NAME is the image's file name without its last extension. The seeds
   * folder is searched first when given (an explicit folder wins), then the image's own folder.
   *
   * @param seedsDir a folder of seed files, or {@code null}
   * @return the seed file, or empty if there is none
   * @throws BadInputException if one folder holds more than one seed file for the image
   */
  public static Optional<Path> find(Path image, Path seedsDir) {
    String base = baseName(image.getFileName().toString());
    List<Path> folders = new ArrayList<>();
    if (seedsDir != null) {
      folders.add(seedsDir);
    }
    Path parent = image.toAbsolutePath().getParent();
    if (parent != null) {
      folders.add(parent);
    }
    for (Path folder : folders) {
      List<Path> found = new ArrayList<>();
      for (String suffix : SUFFIXES) {
        Path candidate = folder.resolve(base + suffix);
        if (Files.isRegularFile(candidate)) {
          found.add(candidate);
        }
      }
      if (found.size() > 1) {
        throw new BadInputException(
            "image "
                + image
                + " has several seed files in "
                + folder
                + ": "
                + found
                + "; keep only one");
      }
      if (found.size() == 1) {
        return Optional.of(found.get(0));
      }
    }
    return Optional.empty();
  }

  /** The file name without its last extension ({@code a.b.tif} → {@code a.b}). */
  static String baseName(String fileName) {
    int dot = fileName.lastIndexOf('.');
    return dot > 0 ? fileName.substring(0, dot) : fileName;
  }
}
