package io.github.cleave.synth;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import ij.IJ;
import ij.ImagePlus;
import ij.measure.Calibration;
import ij.process.ImageProcessor;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SampleWriterTest {

  @Test
  void filesReadBackWithTheSamePixelsCalibrationChannelsAndPlanes(@TempDir Path dir)
      throws IOException {
    long total = 0;
    for (Phantom p : SamplePhantoms.all(SamplePhantoms.DEFAULT_SEED)) {
      SampleWriter.write(p, dir, p.name());
      Raster r = p.image();
      ImagePlus image = IJ.openImage(dir.resolve(p.name() + ".tif").toString());
      assertThat(image).as(p.name()).isNotNull();
      assertThat(image.getWidth()).isEqualTo(r.width());
      assertThat(image.getHeight()).isEqualTo(r.height());
      assertThat(image.getNSlices()).isEqualTo(r.depth());
      assertThat(image.getNFrames()).isEqualTo(1);
      Calibration cal = image.getCalibration();
      assertThat(cal.pixelWidth).isCloseTo(r.voxelSize().x(), within(1e-6));
      assertThat(cal.pixelHeight).isCloseTo(r.voxelSize().y(), within(1e-6));
      assertThat(cal.pixelDepth).isCloseTo(r.voxelSize().z(), within(1e-6));
      assertThat(cal.getUnit()).isEqualTo("\u00b5m");
      if (r.kind() == PixelKind.RGB) {
        assertThat(image.getBitDepth()).isEqualTo(24);
        int[] rgb = (int[]) image.getProcessor().getPixels();
        for (int i = 0; i < rgb.length; i++) {
          assertThat((rgb[i] >> 16) & 0xff).isEqualTo((int) r.channel(0)[i]);
          assertThat((rgb[i] >> 8) & 0xff).isEqualTo((int) r.channel(1)[i]);
          assertThat(rgb[i] & 0xff).isEqualTo((int) r.channel(2)[i]);
        }
      } else {
        assertThat(image.getBitDepth()).isEqualTo(16);
        assertThat(image.getNChannels()).isEqualTo(r.channelCount());
        for (int c = 0; c < r.channelCount(); c++) {
          for (int z = 0; z < r.depth(); z++) {
            ImageProcessor ip = image.getStack().getProcessor(image.getStackIndex(c + 1, z + 1, 1));
            short[] plane = (short[]) ip.getPixels();
            for (int i = 0; i < plane.length; i++) {
              assertThat(plane[i] & 0xffff)
                  .isEqualTo((int) r.channel(c)[i + r.width() * r.height() * z]);
            }
          }
        }
      }
      checkBytes(dir.resolve(p.name() + ".seeds.tif"), p.seeds().labels(), r, 1);
      checkBytes(dir.resolve(p.name() + ".truth.tif"), p.truth(), r, 255);
      for (String suffix : new String[] {".tif", ".seeds.tif", ".truth.tif"}) {
        total += Files.size(dir.resolve(p.name() + suffix));
      }
    }
    // the four samples together stay small enough to bundle
    assertThat(total).isLessThan(5L << 20);
    try (Stream<Path> files = Files.list(dir)) {
      assertThat(files.filter(f -> f.getFileName().toString().endsWith(".part"))).isEmpty();
    }
  }

  private static void checkBytes(Path file, byte[] expected, Raster r, int scale) {
    ImagePlus imp = IJ.openImage(file.toString());
    assertThat(imp.getBitDepth()).isEqualTo(8);
    assertThat(imp.getStackSize()).isEqualTo(r.depth());
    assertThat(imp.getCalibration().pixelWidth).isCloseTo(r.voxelSize().x(), within(1e-6));
    int n = r.width() * r.height();
    for (int z = 0; z < r.depth(); z++) {
      byte[] plane = (byte[]) imp.getStack().getProcessor(z + 1).getPixels();
      for (int i = 0; i < n; i++) {
        int want =
            (expected[i + n * z] & 0xff) == 0 ? 0 : (scale == 1 ? expected[i + n * z] : scale);
        assertThat(plane[i] & 0xff).isEqualTo(want);
      }
    }
  }
}
