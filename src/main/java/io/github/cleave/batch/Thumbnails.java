package io.github.cleave.batch;

import io.github.cleave.render.ContactSheet;
import io.github.cleave.render.OverlayPicture;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import javax.imageio.ImageIO;

/**
 * Contact-sheet thumbnails: a picture copied to {@code TYPE_INT_RGB} and scaled (bilinear, aspect
 * kept) so that its longer side is {@link ContactSheet#THUMBNAIL}, the size the sheet draws it at.
 * A picture made in this run and the same picture read back from its PNG give the same pixels, so a
 * resumed run's sheet equals an uninterrupted run's. Keeping only thumbnails bounds the memory of a
 * long run.
 */
final class Thumbnails {
  private Thumbnails() {}

  static BufferedImage of(BufferedImage picture) {
    int w = picture.getWidth();
    int h = picture.getHeight();
    BufferedImage rgb =
        picture.getType() == BufferedImage.TYPE_INT_RGB
            ? picture
            : OverlayPicture.intRgb(picture.getRGB(0, 0, w, h, null, 0, w), w, h);
    double scale =
        Math.min((double) ContactSheet.THUMBNAIL / w, (double) ContactSheet.THUMBNAIL / h);
    int tw = Math.max(1, (int) Math.round(w * scale));
    int th = Math.max(1, (int) Math.round(h * scale));
    BufferedImage thumb = new BufferedImage(tw, th, BufferedImage.TYPE_INT_RGB);
    Graphics2D g = thumb.createGraphics();
    try {
      g.setRenderingHint(
          RenderingHints.KEY_INTERPOLATION, RenderingHints.VALUE_INTERPOLATION_BILINEAR);
      g.drawImage(rgb, 0, 0, tw, th, null);
    } finally {
      g.dispose();
    }
    return thumb;
  }

  /** The thumbnail of a PNG written earlier, or null if it cannot be read. */
  static BufferedImage read(Path png) {
    try {
      if (!Files.isRegularFile(png)) {
        return null;
      }
      BufferedImage picture = ImageIO.read(png.toFile());
      return picture == null ? null : of(picture);
    } catch (IOException | RuntimeException e) {
      return null;
    }
  }
}
