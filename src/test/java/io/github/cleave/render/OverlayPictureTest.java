package io.github.cleave.render;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import java.awt.image.BufferedImage;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class OverlayPictureTest {
  private static final DisplayRange[] IDENTITY = {new DisplayRange(0, 255)};

  @Test
  void contourOnlyOnTheMaskBoundaryAndInteriorKeepsTheImagesGrey() {
    SplittableRandom random = new SplittableRandom(41);
    for (int trial = 0; trial < 20; trial++) {
      int w = 8 + random.nextInt(30);
      int h = 8 + random.nextInt(30);
      float[] v = new float[w * h];
      byte[] mask = new byte[w * h];
      double cx = random.nextDouble() * w;
      double cy = random.nextDouble() * h;
      double radius = 2 + random.nextDouble() * 8;
      for (int i = 0; i < v.length; i++) {
        v[i] = random.nextInt(256);
        double dx = i % w - cx;
        double dy = i / w - cy;
        mask[i] = dx * dx + dy * dy <= radius * radius ? (byte) 255 : 0;
      }
      Raster raster = Raster.grey(w, h, 1, v, VoxelSize.PIXELS, PixelKind.GREY8);

      BufferedImage picture = OverlayPicture.render(raster, new int[] {0}, mask, null, IDENTITY);

      assertThat(picture.getType()).isEqualTo(BufferedImage.TYPE_INT_RGB);
      for (int y = 0; y < h; y++) {
        for (int x = 0; x < w; x++) {
          int i = x + w * y;
          boolean boundary = mask[i] != 0 && hasBackgroundNeighbour(mask, x, y, w, h);
          int grey = (int) v[i];
          int expected = boundary ? OverlayPicture.CONTOUR : grey << 16 | grey << 8 | grey;
          assertThat(picture.getRGB(x, y) & 0xffffff).as("pixel %d,%d", x, y).isEqualTo(expected);
        }
      }
    }
  }

  @Test
  void seedsAreDrawnInTheExactOkabeItoColours() {
    int w = 6;
    int h = 3;
    byte[] labels = new byte[w * h];
    for (int k = 1; k <= 6; k++) {
      labels[k - 1] = (byte) k;
    }
    labels[w] = 8; // class 8 repeats class 1's colour
    Raster raster = Raster.grey(w, h, 1, new float[w * h], VoxelSize.PIXELS, PixelKind.GREY8);

    BufferedImage picture =
        OverlayPicture.render(
            raster, new int[] {0}, null, new SeedLabels(w, h, 1, labels), IDENTITY);

    // Okabe & Ito, "Color Universal Design" (2002/2008), palette values from memory; the first two
    // are DESIGN.md's stroke colours.
    int[] expected = {0xE69F00, 0x56B4E9, 0x009E73, 0xF0E442, 0x0072B2, 0xD55E00};
    for (int k = 0; k < 6; k++) {
      assertThat(picture.getRGB(k, 0) & 0xffffff).isEqualTo(expected[k]);
    }
    assertThat(picture.getRGB(0, 1) & 0xffffff).isEqualTo(0xE69F00);
    assertThat(picture.getRGB(1, 1) & 0xffffff).isZero();
    assertThat(SeedColours.of(7)).isEqualTo(0xCC79A7);
  }

  @Test
  void stacksShowTheMiddlePlaneAndTwoChannelsAreMagentaAndGreen() {
    int w = 2;
    int h = 1;
    int d = 5;
    float[] a = new float[w * h * d];
    float[] b = new float[w * h * d];
    for (int z = 0; z < d; z++) {
      a[2 * z] = 10 * z;
      b[2 * z] = 100 + z;
    }
    Raster raster = new Raster(w, h, d, new float[][] {a, b}, VoxelSize.PIXELS, PixelKind.GREY16);
    DisplayRange[] ranges = {new DisplayRange(0, 255), new DisplayRange(0, 255)};

    BufferedImage picture = OverlayPicture.render(raster, new int[] {0, 1}, null, null, ranges);

    assertThat(OverlayPicture.displayPlane(d)).isEqualTo(2);
    assertThat(picture.getRGB(0, 0) & 0xffffff).isEqualTo(20 << 16 | 102 << 8 | 20);
  }

  @Test
  void borderBetweenTouchingObjectsIsDrawnInTheBorderColour() {
    int w = 6;
    int h = 3;
    int[] labels = new int[w * h];
    byte[] mask = new byte[w * h];
    for (int i = 0; i < w * h; i++) {
      labels[i] = i % w < 3 ? 1 : 2;
      mask[i] = (byte) 255;
    }
    Raster raster = Raster.grey(w, h, 1, new float[w * h], VoxelSize.PIXELS, PixelKind.GREY8);
    BufferedImage picture =
        OverlayPicture.render(raster, new int[] {0}, IDENTITY, mask, labels, null);
    assertThat(picture.getRGB(2, 1) & 0xffffff).isEqualTo(OverlayPicture.OBJECT_BORDER);
    assertThat(picture.getRGB(3, 1) & 0xffffff).isEqualTo(OverlayPicture.OBJECT_BORDER);
    assertThat(picture.getRGB(1, 1) & 0xffffff).isZero();
  }

  @Test
  void displayRangeUsesNearestRankPercentilesOfTheWholeChannel() {
    float[] values = new float[1000];
    for (int i = 0; i < values.length; i++) {
      values[(i * 7919) % 1000] = i;
    }
    // Nearest rank: index round(0.001 * 999) = 1 and round(0.999 * 999) = 998.
    assertThat(DisplayRange.percentiles(values, 0.1, 99.9)).isEqualTo(new DisplayRange(1, 998));
    assertThat(DisplayRange.percentiles(new float[] {5, 5, 5}, 0.1, 99.9))
        .isEqualTo(new DisplayRange(5, 6));
    Raster rgb =
        new Raster(1, 1, 1, new float[][] {{1}, {2}, {3}}, VoxelSize.PIXELS, PixelKind.RGB);
    assertThat(DisplayRange.of(rgb, 1)).isEqualTo(new DisplayRange(0, 255));
    assertThatThrownBy(() -> new DisplayRange(3, 3)).isInstanceOf(IllegalArgumentException.class);
  }

  private static boolean hasBackgroundNeighbour(byte[] m, int x, int y, int w, int h) {
    int[][] steps = {{1, 0}, {-1, 0}, {0, 1}, {0, -1}};
    for (int[] s : steps) {
      int nx = x + s[0];
      int ny = y + s[1];
      if (nx >= 0 && ny >= 0 && nx < w && ny < h && m[nx + w * ny] == 0) {
        return true;
      }
    }
    return false;
  }

  @Test
  void directPixelsEqualTheColourModelsConversion() {
    // BufferedImage.setRGB through the TYPE_INT_RGB colour model (Java SE API) is the reference
    SplittableRandom random = new SplittableRandom(20261202L);
    for (int trial = 0; trial < 20; trial++) {
      int w = 1 + random.nextInt(40);
      int h = 1 + random.nextInt(40);
      int[] argb = new int[w * h];
      for (int i = 0; i < argb.length; i++) {
        argb[i] = random.nextInt();
      }
      BufferedImage reference = new BufferedImage(w, h, BufferedImage.TYPE_INT_RGB);
      reference.setRGB(0, 0, w, h, argb, 0, w);
      BufferedImage direct = OverlayPicture.intRgb(argb, w, h);
      assertThat(direct.getRGB(0, 0, w, h, null, 0, w))
          .isEqualTo(reference.getRGB(0, 0, w, h, null, 0, w));
    }
  }
}
