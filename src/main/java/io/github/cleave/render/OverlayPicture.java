package io.github.cleave.render;

import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import java.awt.image.BufferedImage;
import java.awt.image.DataBufferInt;
import java.util.Locale;

/**
 * The picture of one segmentation: one plane of the image with the cut boundary and the seeds drawn
 * on it, as an RGB {@link BufferedImage} of the image's width and height. Headless.
 *
 * <p><b>Plane.</b> For a z-stack the middle plane, {@code z = depth / 2} (0-based), is shown, not a
 * projection: the contour and seeds drawn on it then belong to exactly the pixels under them.
 *
 * <p><b>Image.</b> The first up to three of the chosen display channels, each scaled with a fixed
 * {@link DisplayRange} (computed from the whole image by {@link DisplayRange#of} unless the caller
 * passes ranges, so that a folder run can fix one range per channel): one channel in grey; two as
 * magenta (first) and green (second), a colour-blind-safe pair; three as red, green, blue.
 *
 * <p><b>Overlays, drawn in this order, each only as thin 1-pixel lines or seed pixels, never as a
 * filled wash:</b> borders of objects in an optional label image in light grey {@link
 * #OBJECT_BORDER} (label pixels with a 4-neighbour of another label); the cut boundary in white
 * {@link #CONTOUR} (mask pixels with a 4-neighbour outside the mask; the image edge is not a
 * boundary); and seed pixels in their class's Okabe–Ito colour ({@link SeedColours}) on top. White
 * stands out on the dark backgrounds of fluorescence images and is distinct from every seed colour;
 * every other pixel keeps the image's own display colour.
 */
public final class OverlayPicture {
  /** Colour of the cut boundary, white. */
  public static final int CONTOUR = 0xFFFFFF;

  /** Colour of borders between objects of a label image, light grey. */
  public static final int OBJECT_BORDER = 0xBBBBBB;

  private OverlayPicture() {}

  /** The plane shown for an image of {@code depth} planes: {@code depth / 2}. */
  public static int displayPlane(int depth) {
    return depth / 2;
  }

  /** Display ranges of the chosen channels over the whole image, see {@link DisplayRange#of}. */
  public static DisplayRange[] ranges(Raster raster, int[] displayChannels) {
    DisplayRange[] r = new DisplayRange[displayChannels.length];
    for (int i = 0; i < r.length; i++) {
      r[i] = DisplayRange.of(raster, displayChannels[i]);
    }
    return r;
  }

  /** {@link #render(Raster, int[], DisplayRange[], byte[], int[], SeedLabels)} without labels. */
  public static BufferedImage render(
      Raster raster, int[] displayChannels, byte[] mask, SeedLabels seeds, DisplayRange[] ranges) {
    return render(raster, displayChannels, ranges, mask, null, seeds);
  }

  /**
   * Draws the picture.
   *
   * @param displayChannels channels to show (0-based); the first up to three are used
   * @param ranges one range per display channel, or {@code null} to compute them from the data
   * @param mask the segmentation, non-zero = foreground, {@code raster.size()} values, or {@code
   *     null}
   * @param labels object labels (0 background), {@code raster.size()} values, or {@code null}
   * @param seeds seeds of the raster's size, or {@code null}
   * @throws IllegalArgumentException if a channel, range count or array size does not fit
   */
  public static BufferedImage render(
      Raster raster,
      int[] displayChannels,
      DisplayRange[] ranges,
      byte[] mask,
      int[] labels,
      SeedLabels seeds) {
    if (displayChannels.length == 0) {
      throw new IllegalArgumentException("no display channel chosen; choose 1 to 3 channels");
    }
    int shown = Math.min(3, displayChannels.length);
    DisplayRange[] r = ranges == null ? ranges(raster, displayChannels) : ranges;
    if (r.length < shown) {
      throw new IllegalArgumentException(
          r.length + " display ranges for " + shown + " display channels; give one per channel");
    }
    int w = raster.width();
    int h = raster.height();
    int plane = w * h;
    int offset = displayPlane(raster.depth()) * plane;
    checkLength(mask == null ? -1 : mask.length, raster, "mask");
    checkLength(labels == null ? -1 : labels.length, raster, "label image");
    if (seeds != null && !seeds.fits(raster)) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "seeds of %d x %d x %d for an image of %s",
              seeds.width(),
              seeds.height(),
              seeds.depth(),
              raster));
    }
    int[] rgb = new int[plane];
    float[][] ch = new float[shown][];
    for (int k = 0; k < shown; k++) {
      ch[k] = raster.channel(displayChannels[k]);
    }
    for (int i = 0; i < plane; i++) {
      int p = offset + i;
      int a = r[0].grey(ch[0][p]);
      if (shown == 1) {
        rgb[i] = a << 16 | a << 8 | a;
      } else if (shown == 2) {
        int b = r[1].grey(ch[1][p]);
        rgb[i] = a << 16 | b << 8 | a;
      } else {
        rgb[i] = a << 16 | r[1].grey(ch[1][p]) << 8 | r[2].grey(ch[2][p]);
      }
    }
    for (int y = 0; y < h; y++) {
      for (int x = 0; x < w; x++) {
        int i = x + w * y;
        int p = offset + i;
        if (labels != null && labels[p] != 0 && differs(labels, p, x, y, w, h)) {
          rgb[i] = OBJECT_BORDER;
        }
        if (mask != null && mask[p] != 0 && touchesBackground(mask, p, x, y, w, h)) {
          rgb[i] = CONTOUR;
        }
        if (seeds != null && seeds.label(p) != 0) {
          rgb[i] = SeedColours.of(seeds.label(p));
        }
      }
    }
    return intRgb(rgb, w, h);
  }

  /**
   * A {@code TYPE_INT_RGB} picture of the 0xRRGGBB values {@code rgb} (any alpha byte dropped, as
   * {@link BufferedImage#setRGB} drops it for this type), written straight into its pixel array
   * instead of converting pixel by pixel through the colour model.
   */
  public static BufferedImage intRgb(int[] rgb, int w, int h) {
    BufferedImage picture = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
    int[] data = ((DataBufferInt) picture.getRaster().getDataBuffer()).getData();
    for (int i = 0; i < data.length; i++) {
      data[i] = rgb[i] & 0xFFFFFF;
    }
    return picture;
  }

  private static void checkLength(int length, Raster raster, String what) {
    if (length >= 0 && length != raster.size()) {
      throw new IllegalArgumentException(
          what
              + " of "
              + length
              + " values for an image of "
              + raster
              + " ("
              + raster.size()
              + ")");
    }
  }

  /** True if an in-image 4-neighbour of voxel {@code p} (in its plane) is background. */
  static boolean touchesBackground(byte[] mask, int p, int x, int y, int w, int h) {
    return (x > 0 && mask[p - 1] == 0)
        || (x < w - 1 && mask[p + 1] == 0)
        || (y > 0 && mask[p - w] == 0)
        || (y < h - 1 && mask[p + w] == 0);
  }

  private static boolean differs(int[] labels, int p, int x, int y, int w, int h) {
    int v = labels[p];
    return (x > 0 && labels[p - 1] != v)
        || (x < w - 1 && labels[p + 1] != v)
        || (y > 0 && labels[p - w] != v)
        || (y < h - 1 && labels[p + w] != v);
  }
}
