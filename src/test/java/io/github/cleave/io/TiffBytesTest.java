package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;

import ij.ImagePlus;
import ij.Prefs;
import ij.process.ShortProcessor;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The same image gives the same TIFF bytes whatever ImageJ's byte-order preference, and the file is
 * little-endian ("II", TIFF 6.0 specification, section 2, Image File Header) and reads back with
 * the same values.
 */
class TiffBytesTest {
  @Test
  void byteOrderDoesNotFollowThePreference() {
    SplittableRandom random = new SplittableRandom(20261202L);
    short[] pixels = new short[40 * 30];
    for (int i = 0; i < pixels.length; i++) {
      pixels[i] = (short) random.nextInt(65536);
    }
    ImagePlus imp = new ImagePlus("t", new ShortProcessor(40, 30, pixels, null));
    boolean saved = Prefs.intelByteOrder;
    try {
      Prefs.intelByteOrder = false;
      byte[] a = TiffBytes.encode(imp);
      assertThat(Prefs.intelByteOrder).isFalse(); // restored
      Prefs.intelByteOrder = true;
      byte[] b = TiffBytes.encode(imp);
      assertThat(a).isEqualTo(b);
      assertThat(new String(a, 0, 2, java.nio.charset.StandardCharsets.US_ASCII)).isEqualTo("II");
      ImagePlus back = new ij.io.Opener().deserialize(a);
      assertThat((short[]) back.getProcessor().getPixels()).isEqualTo(pixels);
    } finally {
      Prefs.intelByteOrder = saved;
    }
  }
}
