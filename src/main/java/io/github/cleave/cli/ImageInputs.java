package io.github.cleave.cli;

import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.io.LoadedImage;
import io.github.cleave.io.SeedFiles;
import java.nio.file.Path;
import java.util.Optional;

/** Reading an image and its seeds for the segmentation commands, with the messages users see. */
final class ImageInputs {
  private ImageInputs() {}

  /** An image with the seed file found for it (null when there is none and none is needed). */
  record ImageWithSeeds(LoadedImage image, Path seedFile, SeedLabels seeds) {}

  /**
   * Reads the image and its seeds: {@code seedFile} if given, otherwise {@code NAME.seeds.tif|png|
   * zip} next to the image.
   *
   * @param required whether a missing seed file is an error
   */
  static ImageWithSeeds read(Path imageFile, Path seedFile, boolean required) {
    LoadedImage image = ImageFiles.read(imageFile);
    Path seeds = seedFile;
    if (seeds == null) {
      Optional<Path> found = SeedFiles.find(imageFile, null);
      if (found.isEmpty()) {
        if (required) {
          throw new InputException(
              "no seeds for "
                  + imageFile
                  + ": give --seeds FILE (a seed label image or a ROI zip), or put "
                  + io.github.cleave.io.SegmentationFiles.baseName(imageFile)
                  + ".seeds.tif next to the image");
        }
        return new ImageWithSeeds(image, null, null);
      }
      seeds = found.get();
    }
    var r = image.raster();
    SeedLabels labels = SeedFiles.read(seeds, r.width(), r.height(), r.depth());
    return new ImageWithSeeds(image, seeds, labels);
  }
}
