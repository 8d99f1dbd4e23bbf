package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.IJ;
import ij.ImagePlus;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.VoxelSize;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ImageOutputsTest {
  @TempDir Path dir;

  private static final VoxelSize CAL = new VoxelSize(0.3, 0.4, 1.5, "micron", false);

  @Test
  void masksReadBackIdenticallyAs8BitWithCalibration() throws IOException {
    SplittableRandom random = new SplittableRandom(31);
    for (int depth : new int[] {1, 4}) {
      int w = 9;
      int h = 7;
      byte[] mask = new byte[w * h * depth];
      for (int i = 0; i < mask.length; i++) {
        mask[i] = random.nextBoolean() ? (byte) 255 : 0;
      }
      Path file = dir.resolve("m" + depth + ".mask.tif");
      ImageOutputs.writeMask(file, mask, w, h, depth, CAL);

      ImagePlus back = IJ.openImage(file.toString());
      assertThat(back.getBitDepth()).isEqualTo(8);
      assertThat(back.getNSlices()).isEqualTo(depth);
      LoadedImage loaded = ImageFiles.read(file);
      assertSameCalibration(loaded.raster().voxelSize(), depth);
      float[] v = loaded.raster().channel(0);
      for (int i = 0; i < mask.length; i++) {
        assertThat(v[i]).isEqualTo(mask[i] & 0xff);
      }
    }
    assertNoTemporaryFiles();
  }

  @Test
  void labelsReadBackIdenticallyAs16BitAndFloatBeyond65535() throws IOException {
    int w = 300;
    int h = 250;
    int[] labels = new int[w * h];
    for (int i = 0; i < labels.length; i++) {
      labels[i] = i % 70001;
    }
    Path big = dir.resolve("big.labels.tif");
    ImageOutputs.writeLabels(big, labels, 70000, w, h, 1, CAL);
    ImagePlus bigBack = IJ.openImage(big.toString());
    assertThat(bigBack.getBitDepth()).isEqualTo(32);
    float[] bigValues = ImageFiles.read(big).raster().channel(0);
    for (int i = 0; i < labels.length; i++) {
      assertThat(bigValues[i]).isEqualTo(labels[i]);
    }

    int[] small = new int[4 * 3 * 2];
    for (int i = 0; i < small.length; i++) {
      small[i] = i % 6;
    }
    Path file = dir.resolve("s.labels.tif");
    ImageOutputs.writeLabels(file, small, 5, 4, 3, 2, CAL);
    ImagePlus back = IJ.openImage(file.toString());
    assertThat(back.getBitDepth()).isEqualTo(16);
    assertThat(back.getNSlices()).isEqualTo(2);
    LoadedImage loaded = ImageFiles.read(file);
    assertSameCalibration(loaded.raster().voxelSize(), 2);
    for (int i = 0; i < small.length; i++) {
      assertThat(loaded.raster().channel(0)[i]).isEqualTo(small[i]);
    }
    assertThatThrownBy(() -> ImageOutputs.writeLabels(file, small, 4, 4, 3, 2, CAL))
        .isInstanceOf(IllegalArgumentException.class);
    assertNoTemporaryFiles();
  }

  @Test
  void uncalibratedOutputsStayUncalibrated() throws IOException {
    Path file = dir.resolve("p.mask.tif");
    ImageOutputs.writeMask(file, new byte[4], 2, 2, 1, VoxelSize.PIXELS);
    assertThat(ImageFiles.read(file).raster().voxelSize()).isEqualTo(VoxelSize.PIXELS);
  }

  @Test
  void pngRoundTripsExactly() throws IOException {
    BufferedImage picture = new BufferedImage(5, 4, BufferedImage.TYPE_INT_RGB);
    SplittableRandom random = new SplittableRandom(3);
    for (int y = 0; y < 4; y++) {
      for (int x = 0; x < 5; x++) {
        picture.setRGB(x, y, random.nextInt(1 << 24));
      }
    }
    Path file = dir.resolve("o.overlay.png");
    ImageOutputs.writePng(file, picture);
    BufferedImage back = ImageIO.read(file.toFile());
    for (int y = 0; y < 4; y++) {
      for (int x = 0; x < 5; x++) {
        assertThat(back.getRGB(x, y)).isEqualTo(picture.getRGB(x, y));
      }
    }
    assertNoTemporaryFiles();
  }

  @Test
  void outputsMayNotOverwriteInputs() throws IOException {
    Path input = Files.createFile(dir.resolve("in.tif"));
    ImageOutputs.checkNotInput(dir.resolve("in.mask.tif"), List.of(input));
    assertThatThrownBy(
            () -> ImageOutputs.checkNotInput(dir.resolve("sub/../in.tif"), List.of(input)))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("in.tif")
        .hasMessageContaining("overwrite");
  }

  /**
   * TIFF stores the pixel size as a rational resolution, so ImageJ reads 0.3 back as 0.30000003:
   * equal within {@link VoxelSize#differsFrom}'s 1e-4. A single plane carries no z spacing.
   */
  private static void assertSameCalibration(VoxelSize read, int depth) {
    VoxelSize expected = depth > 1 ? CAL : new VoxelSize(CAL.x(), CAL.y(), 1, CAL.unit(), false);
    assertThat(read.differsFrom(expected)).as("%s vs %s", read, expected).isFalse();
    assertThat(read.assumed()).isFalse();
  }

  private void assertNoTemporaryFiles() throws IOException {
    try (Stream<Path> files = Files.list(dir)) {
      assertThat(files.map(p -> p.getFileName().toString()))
          .noneMatch(n -> n.endsWith(".part") || n.startsWith("."));
    }
  }
}
