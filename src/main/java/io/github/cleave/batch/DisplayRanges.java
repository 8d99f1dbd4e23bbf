package io.github.cleave.batch;

import io.github.cleave.io.ImageFiles;
import io.github.cleave.io.LoadedImage;
import io.github.cleave.io.SegmentationFiles;
import io.github.cleave.render.DisplayRange;
import io.github.cleave.render.OverlayPicture;
import io.github.cleave.segment.SegmentationModel;
import java.nio.file.Path;
import java.util.List;
import java.util.function.Function;

/**
 * The display ranges a run fixes for all its pictures, one per shown channel, so that thumbnails
 * compare: those of the first file in run order that can be read and has the model's channel count
 * ({@link DisplayRange#of}: 0.1 and 99.9 percentiles of the whole image; 0..255 for RGB). A model
 * holds likelihoods, not an intensity range that all its implementations could give, so the first
 * image stands for the run. Files that fail here are simply passed over; they fail again, with
 * their reason, when segmented.
 */
final class DisplayRanges {
  private DisplayRanges() {}

  /** The ranges, or null if no file qualifies (then each picture gets its own). */
  static DisplayRange[] first(List<InputScan.InputFile> files, SegmentationModel model) {
    return first(files, model, InputScan.InputFile::path);
  }

  /**
   * The ranges, reading each file from the local path {@code fetch} gives for it (a copy of a file
   * kept elsewhere), or null if no file qualifies. A fetch that throws passes the file over.
   */
  static DisplayRange[] first(
      List<InputScan.InputFile> files,
      SegmentationModel model,
      Function<InputScan.InputFile, Path> fetch) {
    for (InputScan.InputFile f : files) {
      try {
        LoadedImage image = ImageFiles.read(fetch.apply(f));
        if (image.raster().channelCount() != model.imageChannels()) {
          continue;
        }
        int[] channels = SegmentationFiles.displayChannels(image.raster(), model);
        return OverlayPicture.ranges(image.raster(), channels);
      } catch (RuntimeException | OutOfMemoryError e) {
        // this file fails later with its reason
      }
    }
    return null;
  }
}
