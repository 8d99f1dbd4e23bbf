package io.github.cleave.io;

import io.github.cleave.image.Raster;
import java.nio.file.Path;
import java.util.List;
import java.util.Objects;

/**
 * An image as read by {@link ImageFiles}: its raw pixel values and what the file said about them.
 * Immutable (the raster's arrays are immutable by convention, see {@link Raster}).
 *
 * @param raster raw pixel values, one channel per image channel (three for RGB), all z planes
 * @param source the file read, or {@code null} for an image that did not come from a file
 * @param title the image's title (file name without folder for files)
 * @param channelNames one name per channel of the raster where the file named them (slice labels of
 *     a composite, "red", "green", "blue" for RGB), otherwise empty
 * @param bitDepth ImageJ's bit depth of the original image: 8, 16, 24 (RGB) or 32
 * @param imageType ImageJ's image type of the original ({@code ImagePlus.GRAY8}, {@code GRAY16},
 *     {@code GRAY32}, {@code COLOR_RGB})
 * @param invertedLut true when an 8-bit image was shown with an inverting lookup table; the raster
 *     still holds the raw stored values, not the displayed ones
 */
public record LoadedImage(
    Raster raster,
    Path source,
    String title,
    List<String> channelNames,
    int bitDepth,
    int imageType,
    boolean invertedLut) {

  /** Copies the channel names; checks that they fit the raster. */
  public LoadedImage {
    Objects.requireNonNull(raster, "raster");
    Objects.requireNonNull(title, "title");
    channelNames = List.copyOf(channelNames);
    if (!channelNames.isEmpty() && channelNames.size() != raster.channelCount()) {
      throw new IllegalArgumentException(
          channelNames.size()
              + " channel names for an image of "
              + raster.channelCount()
              + " channels; give one per channel or none");
    }
  }
}
