package io.github.cleave.io;

import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.RoiExport;
import io.github.cleave.render.DisplayRange;
import io.github.cleave.render.OverlayPicture;
import io.github.cleave.segment.ClassMap;
import io.github.cleave.segment.Segmentation;
import io.github.cleave.segment.SegmentationModel;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * Writes the outputs of one segmentation under the names of DESIGN.md, for an input {@code
 * NAME.EXT}: {@code NAME.mask.tif} (8-bit, 0/255), {@code NAME.labels.tif} (16-bit object numbers),
 * {@code NAME.objects.csv}, {@code NAME.rois.zip}, {@code NAME.overlay.png} (the cut as a thin
 * contour over the image, strokes in their colours) and, last, {@code NAME.record.json} (settings,
 * versions, timings, checksums): a record present means every other output of that image is
 * complete. A segmentation into three or more classes adds {@code NAME.classes.tif} (8-bit, the
 * class 1..K of every voxel), a {@code class} column in the table, and ROI names ending in {@code
 * -classN}. Every file is written atomically; none may be an input file.
 */
public final class SegmentationFiles {
  private SegmentationFiles() {}

  /** What went into a segmentation, for the record and for input protection. */
  public record Inputs(Path image, Path seeds, Path model) {}

  /** The output names for an input file name (the part before the last dot). */
  public static String baseName(Path image) {
    String name = image.getFileName().toString();
    int dot = name.lastIndexOf('.');
    return dot > 0 ? name.substring(0, dot) : name;
  }

  /** The record file of an input in {@code outDir}; it is written last. */
  public static Path recordFile(Path outDir, String name) {
    return outDir.resolve(name + ".record.json");
  }

  /**
   * Checks that {@code outDir} is usable: not the folder of an input file, not an existing file;
   * creates it if missing.
   *
   * @throws BadInputException if the output folder is an input folder or cannot be created
   */
  public static void prepareOutputFolder(Path outDir, Inputs inputs) {
    if (Files.exists(outDir) && !Files.isDirectory(outDir)) {
      throw new BadInputException(
          "the output " + outDir + " is a file, not a folder: give a folder for the results");
    }
    try {
      Files.createDirectories(outDir);
    } catch (IOException e) {
      throw new BadInputException(
          "cannot create the output folder " + outDir + " (" + e.getMessage() + ")", e);
    }
    for (Path input : inputList(inputs)) {
      Path folder = input.toAbsolutePath().getParent();
      boolean same;
      try {
        same = folder != null && Files.isSameFile(outDir, folder); // follows links
      } catch (IOException e) {
        same = false; // the input folder vanished: the input will fail on its own
      }
      if (same) {
        throw new BadInputException(
            "the output folder "
                + outDir
                + " is the folder of the input "
                + input.getFileName()
                + ": choose another output folder so that inputs are never overwritten");
      }
    }
  }

  /**
   * Writes every output of {@code result} for the image {@code image} into {@code outDir}.
   *
   * @param seeds the seeds to draw on the overlay (may be null)
   * @return the overlay picture written, for contact sheets
   */
  public static BufferedImage write(
      Path outDir,
      String name,
      LoadedImage image,
      SeedLabels seeds,
      Segmentation result,
      Inputs inputs,
      String command)
      throws IOException {
    return write(outDir, name, image, seeds, result, inputs, command, null);
  }

  /**
   * Writes every output as {@link #write(Path, String, LoadedImage, SeedLabels, Segmentation,
   * Inputs, String)} does, drawing the overlay with the given display ranges (one per channel of
   * {@link #displayChannels}), so that the pictures of a folder run compare.
   *
   * @param ranges display ranges for the overlay, or {@code null} to compute them from the image
   * @return the overlay picture written, for contact sheets
   */
  public static BufferedImage write(
      Path outDir,
      String name,
      LoadedImage image,
      SeedLabels seeds,
      Segmentation result,
      Inputs inputs,
      String command,
      DisplayRange[] ranges)
      throws IOException {
    Raster raster = image.raster();
    List<Path> protectedFiles = inputList(inputs);
    int w = raster.width();
    int h = raster.height();
    int d = raster.depth();
    Path mask = outDir.resolve(name + ".mask.tif");
    Path labels = outDir.resolve(name + ".labels.tif");
    Path csv = outDir.resolve(name + ".objects.csv");
    Path rois = outDir.resolve(name + ".rois.zip");
    Path overlay = outDir.resolve(name + ".overlay.png");
    Path record = recordFile(outDir, name);
    Path classMap = outDir.resolve(name + ".classes.tif");
    for (Path p : List.of(mask, labels, csv, rois, overlay, record, classMap)) {
      ImageOutputs.checkNotInput(p, protectedFiles);
    }
    ClassMap classes = result.classes();
    int[] objectClasses = classes == null ? null : classes.objectClasses();
    Files.deleteIfExists(record); // an old record must not vouch for outputs being replaced
    ImageOutputs.writeMask(mask, result.mask(), w, h, d, result.voxelSize());
    ImageOutputs.writeLabels(
        labels, result.objects().labels(), result.objects().count(), w, h, d, result.voxelSize());
    if (classes != null) {
      ImageOutputs.writeClassMap(
          classMap, classes.labels(), classes.classCount(), w, h, d, result.voxelSize());
    } else {
      Files.deleteIfExists(classMap); // left by an earlier run with more classes
    }
    byte[] table =
        ObjectsCsv.table(
                result.measurements(),
                d > 1,
                result.voxelSize().unit(),
                measuredChannels(result, raster),
                objectClasses)
            .getBytes(StandardCharsets.UTF_8);
    AtomicFiles.write(csv, out -> out.write(table));
    byte[] zip = RoiExport.roiZip(result.objects(), objectClasses);
    AtomicFiles.write(rois, out -> out.write(zip));
    BufferedImage picture =
        OverlayPicture.render(
            raster,
            displayChannels(raster, result),
            ranges,
            result.mask(),
            result.objects().labels(),
            seeds);
    ImageOutputs.writePng(overlay, picture);
    byte[] json = RunRecord.json(name, image, inputs, result, command);
    AtomicFiles.write(record, out -> out.write(json));
    return picture;
  }

  /** The channels shown in pictures: RGB as colour, otherwise the driving channels. */
  public static int[] displayChannels(Raster raster, Segmentation result) {
    return displayChannels(raster, result.model());
  }

  /** The channels shown in pictures of {@code raster} segmented with {@code model}. */
  public static int[] displayChannels(Raster raster, SegmentationModel model) {
    if (raster.kind() == PixelKind.RGB) {
      return new int[] {0, 1, 2};
    }
    int[] driving = model.settings().drivingChannels();
    return driving != null ? driving : new int[] {0};
  }

  static int[] measuredChannels(Segmentation result, Raster raster) {
    return measuredChannels(result, raster.channelCount());
  }

  static int[] measuredChannels(Segmentation result, int channelCount) {
    int[] chosen = result.model().settings().measuredChannels();
    if (chosen != null) {
      return chosen;
    }
    int[] all = new int[channelCount];
    for (int c = 0; c < all.length; c++) {
      all[c] = c;
    }
    return all;
  }

  static List<Path> inputList(Inputs inputs) {
    List<Path> list = new ArrayList<>();
    for (Path p : new Path[] {inputs.image(), inputs.seeds(), inputs.model()}) {
      if (p != null) {
        list.add(p);
      }
    }
    return list;
  }
}
