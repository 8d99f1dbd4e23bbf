package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.zip.CRC32;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;

/**
 * The PNG encoder against the JDK's own PNG decoder ({@code javax.imageio}, an independent
 * implementation) and the chunk layout of the PNG specification (W3C PNG Specification, Second
 * Edition, 2003, sections 5.2-5.6 and 11.2: signature, length, type, data, CRC-32 over type and
 * data; IHDR first, IEND last and empty).
 */
class PngEncoderTest {

  @Test
  void theJdkDecoderReadsBackEveryPixel() throws IOException {
    SplittableRandom random = new SplittableRandom(41L);
    for (int trial = 0; trial < 40; trial++) {
      int w = 1 + random.nextInt(trial < 5 ? 3 : 90);
      int h = 1 + random.nextInt(trial < 5 ? 3 : 90);
      int type =
          switch (trial % 3) {
            case 0 -> BufferedImage.TYPE_INT_RGB;
            case 1 -> BufferedImage.TYPE_INT_ARGB; // read through getRGB, alpha dropped
            default -> BufferedImage.TYPE_3BYTE_BGR;
          };
      BufferedImage picture = new BufferedImage(w, h, type);
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          // smooth grey with random colour specks, like an overlay
          int g = (x * 7 + y * 3) & 0xff;
          int rgb = random.nextInt(10) == 0 ? random.nextInt(1 << 24) : g * 0x010101;
          picture.setRGB(x, y, 0xff000000 | rgb);
        }
      }
      assertSamePixels(picture, decode(encode(picture)));
    }
  }

  @Test
  void aSubImageIsWrittenAsItself() throws IOException {
    BufferedImage whole = new BufferedImage(20, 10, BufferedImage.TYPE_INT_RGB);
    SplittableRandom random = new SplittableRandom(3L);
    for (int y = 0; y < 10; y++) {
      for (int x = 0; x < 20; x++) {
        whole.setRGB(x, y, random.nextInt(1 << 24));
      }
    }
    BufferedImage part = whole.getSubimage(5, 2, 9, 6); // shares the pixel array of `whole`
    assertSamePixels(part, decode(encode(part)));
  }

  @Test
  void chunksFollowTheSpecificationAndSplitLargeData() throws IOException {
    SplittableRandom random = new SplittableRandom(8L);
    BufferedImage noise = new BufferedImage(300, 300, BufferedImage.TYPE_INT_RGB);
    for (int y = 0; y < 300; y++) {
      for (int x = 0; x < 300; x++) {
        noise.setRGB(x, y, random.nextInt(1 << 24)); // incompressible: several IDAT chunks
      }
    }
    byte[] png = encode(noise);
    assertThat(java.util.Arrays.copyOf(png, 8))
        .containsExactly(0x89, 'P', 'N', 'G', 0x0d, 0x0a, 0x1a, 0x0a);
    ByteBuffer b = ByteBuffer.wrap(png, 8, png.length - 8);
    List<String> types = new ArrayList<>();
    while (b.hasRemaining()) {
      int length = b.getInt();
      byte[] typeAndData = new byte[4 + length];
      b.get(typeAndData);
      CRC32 crc = new CRC32();
      crc.update(typeAndData);
      assertThat(b.getInt()).isEqualTo((int) crc.getValue());
      String type = new String(typeAndData, 0, 4, StandardCharsets.US_ASCII);
      types.add(type);
      if (type.equals("IHDR")) {
        ByteBuffer h = ByteBuffer.wrap(typeAndData, 4, length);
        assertThat(h.getInt()).isEqualTo(300);
        assertThat(h.getInt()).isEqualTo(300);
        assertThat(new byte[] {h.get(), h.get(), h.get(), h.get(), h.get()})
            .containsExactly(
                8, 2, 0, 0, 0); // 8 bits, RGB, deflate, adaptive filtering, no interlace
      }
      if (type.equals("IDAT")) {
        assertThat(length).isBetween(1, PngEncoder.CHUNK);
      }
      if (type.equals("IEND")) {
        assertThat(length).isZero();
      }
    }
    assertThat(types.get(0)).isEqualTo("IHDR");
    assertThat(types.get(types.size() - 1)).isEqualTo("IEND");
    assertThat(types.stream().filter("IDAT"::equals).count()).isGreaterThan(2);
    assertSamePixels(noise, decode(png));
  }

  @Test
  void theBytesDependOnThePixelsAlone() throws IOException {
    BufferedImage a = new BufferedImage(33, 17, BufferedImage.TYPE_INT_RGB);
    BufferedImage b = new BufferedImage(33, 17, BufferedImage.TYPE_INT_ARGB);
    SplittableRandom random = new SplittableRandom(12L);
    for (int y = 0; y < 17; y++) {
      for (int x = 0; x < 33; x++) {
        int rgb = random.nextInt(1 << 24);
        a.setRGB(x, y, rgb);
        b.setRGB(x, y, 0xff000000 | rgb);
      }
    }
    assertThat(encode(a)).isEqualTo(encode(b)).isEqualTo(encode(a));
  }

  private static byte[] encode(BufferedImage picture) throws IOException {
    ByteArrayOutputStream out = new ByteArrayOutputStream();
    PngEncoder.write(picture, out);
    return out.toByteArray();
  }

  private static BufferedImage decode(byte[] png) throws IOException {
    BufferedImage read = ImageIO.read(new ByteArrayInputStream(png));
    assertThat(read).isNotNull();
    return read;
  }

  private static void assertSamePixels(BufferedImage expected, BufferedImage actual) {
    assertThat(actual.getWidth()).isEqualTo(expected.getWidth());
    assertThat(actual.getHeight()).isEqualTo(expected.getHeight());
    for (int y = 0; y < expected.getHeight(); y++) {
      for (int x = 0; x < expected.getWidth(); x++) {
        assertThat(actual.getRGB(x, y) & 0xffffff)
            .as("pixel (%d, %d)", x, y)
            .isEqualTo(expected.getRGB(x, y) & 0xffffff);
      }
    }
  }
}
