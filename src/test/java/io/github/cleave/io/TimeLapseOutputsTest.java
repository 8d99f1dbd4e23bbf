package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.IJ;
import ij.ImagePlus;
import ij.measure.Calibration;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class TimeLapseOutputsTest {
  @TempDir Path dir;

  private static final TimeLapseGeometry GEOMETRY =
      new TimeLapseGeometry(7, 5, 3, 4, new VoxelSize(0.2, 0.25, 0.6, "micron", false), 0.5, "min");

  /** Checks dimensions and calibration as ImageJ itself reads the file back. */
  private static ImagePlus openedByImageJ(Path file, TimeLapseGeometry g, int bitDepth) {
    ImagePlus imp = IJ.openImage(file.toString());
    assertThat(imp.getBitDepth()).isEqualTo(bitDepth);
    assertThat(imp.getNChannels()).isEqualTo(1);
    assertThat(imp.getNSlices()).isEqualTo(g.depth());
    assertThat(imp.getNFrames()).isEqualTo(g.frames());
    Calibration cal = imp.getCalibration();
    assertThat(cal.pixelWidth).isEqualTo(g.voxelSize().x());
    assertThat(cal.pixelHeight).isEqualTo(g.voxelSize().y());
    assertThat(cal.pixelDepth).isEqualTo(g.voxelSize().z());
    assertThat(cal.getUnit()).isEqualTo(g.voxelSize().unit());
    assertThat(cal.frameInterval).isEqualTo(g.frameInterval());
    assertThat(cal.getTimeUnit()).isEqualTo(g.timeUnit());
    return imp;
  }

  /** Value of voxel i of frame t, from ImageJ's plane by the documented hyperstack order. */
  private static float valueAt(ImagePlus imp, TimeLapseGeometry g, int t, int i) {
    int plane = g.width() * g.height();
    int z = i / plane;
    int index = HyperstackImages.index(0, z, t, 1, g.depth());
    int p = i % plane;
    return imp.getStack().getProcessor(index).getf(p % g.width(), p / g.width());
  }

  private void assertNoTemporaryFiles() throws IOException {
    try (Stream<Path> files = Files.list(dir)) {
      assertThat(files.map(p -> p.getFileName().toString())).noneMatch(n -> n.endsWith(".part"));
    }
  }

  @Test
  void masksReadBackEqual() throws IOException {
    SplittableRandom random = new SplittableRandom(5);
    List<byte[]> masks = new ArrayList<>();
    for (int t = 0; t < GEOMETRY.frames(); t++) {
      byte[] m = new byte[GEOMETRY.frameSize()];
      for (int i = 0; i < m.length; i++) {
        m[i] = random.nextBoolean() ? (byte) 255 : 0;
      }
      masks.add(m);
    }
    Path file = dir.resolve("movie.mask.tif");
    TimeLapseOutputs.writeMasks(file, masks, GEOMETRY);

    ImagePlus imp = openedByImageJ(file, GEOMETRY, 8);
    OpenedSeries series = Hyperstacks.openSeries(file, TimeAxis.AUTO);
    assertThat(series.geometry())
        .isEqualTo(new TimeLapseGeometry(7, 5, 3, 4, GEOMETRY.voxelSize(), 0.5, "min"));
    for (int t = 0; t < GEOMETRY.frames(); t++) {
      Raster r = series.frame(t);
      for (int i = 0; i < GEOMETRY.frameSize(); i++) {
        assertThat(r.channel(0)[i]).isEqualTo(masks.get(t)[i] & 0xff);
        assertThat(valueAt(imp, GEOMETRY, t, i)).isEqualTo(masks.get(t)[i] & 0xff);
      }
    }
    assertNoTemporaryFiles();
  }

  @ParameterizedTest
  @ValueSource(ints = {1000, 65535, 70000})
  void labelsReadBackEqualIn16BitUpTo65535ElseFloat(int count) throws IOException {
    SplittableRandom random = new SplittableRandom(count);
    List<int[]> labels = new ArrayList<>();
    for (int t = 0; t < GEOMETRY.frames(); t++) {
      int[] l = new int[GEOMETRY.frameSize()];
      for (int i = 0; i < l.length; i++) {
        l[i] = random.nextInt(4) == 0 ? 0 : random.nextInt(count + 1);
      }
      labels.add(l);
    }
    labels.get(2)[7] = count;
    Path file = dir.resolve("movie.labels.tif");
    TimeLapseOutputs.writeLabels(file, labels, count, GEOMETRY);

    ImagePlus imp = openedByImageJ(file, GEOMETRY, count <= 65535 ? 16 : 32);
    OpenedSeries series = Hyperstacks.openSeries(file, TimeAxis.AUTO);
    assertThat(series.frameInterval()).isEqualTo(0.5);
    for (int t = 0; t < GEOMETRY.frames(); t++) {
      Raster r = series.frame(t);
      for (int i = 0; i < GEOMETRY.frameSize(); i++) {
        assertThat(r.channel(0)[i]).isEqualTo(labels.get(t)[i]);
        assertThat(valueAt(imp, GEOMETRY, t, i)).isEqualTo(labels.get(t)[i]);
      }
    }
  }

  @Test
  void classMapsOfPlanesWithoutCalibrationReadBackEqual() throws IOException {
    TimeLapseGeometry g = new TimeLapseGeometry(9, 4, 1, 6, VoxelSize.PIXELS, Double.NaN, "frame");
    SplittableRandom random = new SplittableRandom(8);
    List<byte[]> maps = new ArrayList<>();
    for (int t = 0; t < g.frames(); t++) {
      byte[] m = new byte[g.frameSize()];
      for (int i = 0; i < m.length; i++) {
        m[i] = (byte) random.nextInt(6);
      }
      maps.add(m);
    }
    Path file = dir.resolve("movie.classes.tif");
    TimeLapseOutputs.writeClassMaps(file, maps, g);

    ImagePlus imp = IJ.openImage(file.toString());
    assertThat(imp.getNFrames()).isEqualTo(6);
    assertThat(imp.getNSlices()).isEqualTo(1);
    assertThat(imp.getCalibration().scaled()).isFalse();
    assertThat(imp.getCalibration().frameInterval).isZero();
    OpenedSeries series = Hyperstacks.openSeries(file, TimeAxis.AUTO);
    assertThat(series.geometry()).isEqualTo(g);
    for (int t = 0; t < g.frames(); t++) {
      Raster r = series.frame(t);
      for (int i = 0; i < g.frameSize(); i++) {
        assertThat(r.channel(0)[i]).isEqualTo(maps.get(t)[i]);
      }
    }
  }

  @Test
  void wrongInputIsRefusedAndLeavesNoFile() throws IOException {
    Path file = dir.resolve("bad.tif");
    List<byte[]> three = List.of(new byte[105], new byte[105], new byte[105]);
    assertThatThrownBy(() -> TimeLapseOutputs.writeMasks(file, three, GEOMETRY))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("3 masks")
        .hasMessageContaining("4 time points");
    List<byte[]> wrongValue = new ArrayList<>();
    for (int t = 0; t < 4; t++) {
      wrongValue.add(new byte[105]);
    }
    wrongValue.get(3)[10] = 7;
    assertThatThrownBy(() -> TimeLapseOutputs.writeMasks(file, wrongValue, GEOMETRY))
        .hasMessageContaining("mask value 7 at index 10 of time point 4");
    List<int[]> labels = new ArrayList<>();
    for (int t = 0; t < 4; t++) {
      labels.add(new int[t == 1 ? 104 : 105]);
    }
    assertThatThrownBy(() -> TimeLapseOutputs.writeLabels(file, labels, 3, GEOMETRY))
        .hasMessageContaining("time point 2 has 104 values");
    labels.set(1, new int[105]);
    labels.get(0)[0] = 4;
    assertThatThrownBy(() -> TimeLapseOutputs.writeLabels(file, labels, 3, GEOMETRY))
        .hasMessageContaining("label 4");
    assertThatThrownBy(() -> new TimeLapseGeometry(4, 4, 1, 2, VoxelSize.PIXELS, -1, "s"))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("frame interval -1");
    assertThat(file).doesNotExist();
    assertNoTemporaryFiles();
  }
}
