package io.github.cleave.io;

import ij.ImagePlus;
import ij.Prefs;
import ij.io.FileSaver;

/**
 * An image encoded as an ImageJ TIFF in one fixed byte order, little-endian ("II"), whatever the
 * user's ImageJ preferences say.
 *
 * <p>ImageJ's encoder takes its byte order from the global preference {@code Prefs.intelByteOrder},
 * which ImageJ loads from the user's preferences file when it starts (and a user may change);
 * outputs written through it would differ byte for byte between machines, between a plugin session
 * and the command line, or after another ImageJ run saved its preferences. So the encoding sets the
 * preference to little-endian (ImageJ's default for new installations and the order of the bundled
 * sample images) and restores it at once, under a lock shared by every encoding of ours. Another
 * thread of the host that saves a TIFF within that moment would see the same setting, at worst
 * writing its file little-endian, which every TIFF reader accepts. Thread-safe.
 */
public final class TiffBytes {
  private static final Object LOCK = new Object();

  private TiffBytes() {}

  /**
   * The TIFF file contents of {@code imp} (with ImageJ's description, calibration and stack
   * layout), or null when ImageJ cannot encode it.
   */
  public static byte[] encode(ImagePlus imp) {
    FileSaver saver = new FileSaver(imp);
    synchronized (LOCK) {
      boolean saved = Prefs.intelByteOrder;
      try {
        Prefs.intelByteOrder = true;
        return saver.serialize();
      } finally {
        Prefs.intelByteOrder = saved;
      }
    }
  }
}
