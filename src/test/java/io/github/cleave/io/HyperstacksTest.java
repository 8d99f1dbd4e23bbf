package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;

import ij.ImagePlus;
import ij.VirtualStack;
import ij.measure.Calibration;
import ij.process.ImageProcessor;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class HyperstacksTest {
  @TempDir Path dir;

  private static Calibration calibration(double frameInterval, String timeUnit) {
    Calibration cal = TestImages.microns(0.25, 0.5, 2);
    cal.frameInterval = frameInterval;
    cal.setTimeUnit(timeUnit);
    return cal;
  }

  @ParameterizedTest
  @ValueSource(ints = {8, 16, 24, 32})
  void everyFrameOfASavedHyperstackHoldsExactlyItsPlanesInChannelAndZOrder(int bitDepth) {
    boolean rgb = bitDepth == 24;
    int channels = rgb ? 1 : 2;
    ImagePlus imp = HyperstackImages.hyperstack(bitDepth, 7, 5, channels, 3, 4, 100 + bitDepth);
    imp.setCalibration(calibration(1.5, "sec"));
    Path file = TestImages.saveTiff(imp, dir.resolve("hyper" + bitDepth + ".tif"));

    OpenedSeries series = Hyperstacks.openSeries(file, TimeAxis.AUTO);

    assertThat(series.timeSource()).isEqualTo(OpenedSeries.TimeSource.FRAMES);
    assertThat(series.warnings()).isEmpty();
    assertThat(series.frameCount()).isEqualTo(4);
    assertThat(series.depth()).isEqualTo(3);
    assertThat(series.channelCount()).isEqualTo(rgb ? 3 : 2);
    assertThat(series.bitDepth()).isEqualTo(bitDepth);
    assertThat(series.frameInterval()).isEqualTo(1.5);
    assertThat(series.timeUnit()).isEqualTo("s");
    assertThat(series.voxelSize()).isEqualTo(new VoxelSize(0.25, 0.5, 2, "micron", false));
    // Frames in a scrambled order: each read stands alone.
    for (int t : new int[] {2, 0, 3, 1, 2}) {
      Raster r = series.frame(t);
      assertThat(r.width()).isEqualTo(7);
      assertThat(r.height()).isEqualTo(5);
      assertThat(r.depth()).isEqualTo(3);
      assertThat(r.kind()).isEqualTo(ImageFiles.kindOf(bitDepth, "x"));
      assertThat(HyperstackImages.firstDifference(imp, r, t, rgb)).isNull();
      for (int c = 0; c < channels; c++) {
        for (int z = 0; z < 3; z++) {
          assertThat(r.channel(c)[z * 35]).isEqualTo(HyperstackImages.code(c, z, t, channels, 3));
        }
      }
    }
  }

  @Test
  void openImageGivesTheSameFramesAsTheFile() {
    ImagePlus imp = HyperstackImages.hyperstack(16, 6, 4, 2, 3, 4, 7);
    imp.setCalibration(calibration(30, "min"));
    Path file = TestImages.saveTiff(imp, dir.resolve("same.tif"));

    OpenedSeries fromFile = Hyperstacks.openSeries(file, TimeAxis.AUTO);
    OpenedSeries fromImage = Hyperstacks.of(imp, TimeAxis.AUTO);

    assertThat(fromImage.frameCount()).isEqualTo(4);
    assertThat(fromImage.frameInterval()).isEqualTo(30);
    assertThat(fromImage.timeUnit()).isEqualTo("min");
    assertThat(fromImage.source()).isNull();
    for (int t = 0; t < 4; t++) {
      Raster a = fromFile.frame(t);
      Raster b = fromImage.frame(t);
      for (int c = 0; c < 2; c++) {
        assertThat(a.channel(c)).containsExactly(b.channel(c));
      }
    }
  }

  @Test
  void singleTimePointMatchesTheImageReader() {
    // Cross-check against ImageFiles, the reader of single time points.
    ImagePlus imp = HyperstackImages.hyperstack(16, 9, 8, 2, 3, 1, 11);
    imp.setCalibration(TestImages.microns(0.3, 0.3, 1.2));
    Path file = TestImages.saveTiff(imp, dir.resolve("volume.tif"));

    OpenedSeries series = Hyperstacks.openSeries(file, TimeAxis.AUTO);
    LoadedImage first = series.firstFrame();
    LoadedImage read = ImageFiles.read(file);

    assertThat(series.timeSource()).isEqualTo(OpenedSeries.TimeSource.NONE);
    assertThat(series.frameCount()).isEqualTo(1);
    assertThat(series.frameInterval()).isNaN();
    assertThat(first.title()).isEqualTo(read.title());
    assertThat(first.source()).isEqualTo(read.source());
    assertThat(first.channelNames()).isEqualTo(read.channelNames());
    assertThat(first.bitDepth()).isEqualTo(read.bitDepth());
    assertThat(first.imageType()).isEqualTo(read.imageType());
    assertThat(first.raster().voxelSize()).isEqualTo(read.raster().voxelSize());
    assertThat(first.raster().depth()).isEqualTo(3);
    for (int c = 0; c < 2; c++) {
      assertThat(first.raster().channel(c)).containsExactly(read.raster().channel(c));
    }
  }

  /** A virtual stack of planes kept in memory that records which planes were asked for. */
  private static final class CountingStack extends VirtualStack {
    private final ImagePlus source;
    final List<Integer> asked = new ArrayList<>();

    CountingStack(ImagePlus source) {
      super(source.getWidth(), source.getHeight());
      this.source = source;
      setBitDepth(source.getBitDepth());
    }

    @Override
    public ImageProcessor getProcessor(int n) {
      asked.add(n);
      return source.getStack().getProcessor(n).duplicate();
    }

    @Override
    public int getSize() {
      return source.getStackSize();
    }

    @Override
    public int size() {
      return getSize();
    }

    @Override
    public String getSliceLabel(int n) {
      return null;
    }
  }

  @ParameterizedTest
  @ValueSource(ints = {8, 16, 24, 32})
  void aVirtualStackIsAskedOnlyForThePlanesOfTheFrameRead(int bitDepth) {
    boolean rgb = bitDepth == 24;
    int channels = rgb ? 1 : 2;
    ImagePlus truth = HyperstackImages.hyperstack(bitDepth, 5, 4, channels, 3, 4, 200 + bitDepth);
    CountingStack stack = new CountingStack(truth);
    ImagePlus imp = new ImagePlus("virtual", stack);
    imp.setDimensions(channels, 3, 4);
    OpenedSeries series = Hyperstacks.of(imp, TimeAxis.AUTO);
    SplittableRandom random = new SplittableRandom(bitDepth);

    for (int k = 0; k < 12; k++) {
      int t = random.nextInt(4);
      stack.asked.clear();
      Raster r = series.frame(t);
      Set<Integer> expected = new HashSet<>();
      for (int z = 0; z < 3; z++) {
        for (int c = 0; c < channels; c++) {
          expected.add(HyperstackImages.index(c, z, t, channels, 3));
        }
      }
      assertThat(stack.asked).hasSize(channels * 3);
      assertThat(new HashSet<>(stack.asked)).isEqualTo(expected);
      assertThat(HyperstackImages.firstDifference(truth, r, t, rgb)).isNull();
    }
  }

  @Test
  void timeLapseSavedAsSlicesWithAFrameIntervalIsReadAsFramesWithAWarning() {
    ImagePlus imp = HyperstackImages.hyperstack(16, 6, 5, 1, 5, 1, 21);
    Calibration cal = TestImages.microns(0.4, 0.4, 1); // z spacing left at ImageJ's default
    cal.frameInterval = 2;
    cal.setTimeUnit("min");
    imp.setCalibration(cal);
    Path file = TestImages.saveTiff(imp, dir.resolve("slices.tif"));

    OpenedSeries auto = Hyperstacks.openSeries(file, TimeAxis.AUTO);
    assertThat(auto.timeSource()).isEqualTo(OpenedSeries.TimeSource.SLICES_AS_FRAMES);
    assertThat(auto.frameCount()).isEqualTo(5);
    assertThat(auto.depth()).isEqualTo(1);
    assertThat(auto.frameInterval()).isEqualTo(2);
    assertThat(auto.timeUnit()).isEqualTo("min");
    assertThat(auto.voxelSize()).isEqualTo(new VoxelSize(0.4, 0.4, 1, "micron", false));
    assertThat(auto.warnings())
        .singleElement()
        .asString()
        .contains("slices.tif", "5 time points", "slices-are-z");
    for (int t = 0; t < 5; t++) {
      Raster r = auto.frame(t);
      assertThat(r.depth()).isEqualTo(1);
      // Slice t of the file (stack plane t + 1) is time point t.
      short[] slice = (short[]) imp.getStack().getProcessor(t + 1).getPixels();
      float[] values = r.channel(0);
      for (int i = 0; i < slice.length; i++) {
        assertThat(values[i]).isEqualTo(slice[i] & 0xffff);
      }
      assertThat(values[0]).isEqualTo(HyperstackImages.code(0, t, 0, 1, 5));
    }

    OpenedSeries volume = Hyperstacks.openSeries(file, TimeAxis.SLICES_ARE_Z);
    assertThat(volume.timeSource()).isEqualTo(OpenedSeries.TimeSource.NONE);
    assertThat(volume.frameCount()).isEqualTo(1);
    assertThat(volume.depth()).isEqualTo(5);
    assertThat(volume.frameInterval()).isNaN();
    assertThat(volume.reason()).contains("as asked");
    assertThat(HyperstackImages.firstDifference(imp, volume.frame(0), 0, false)).isNull();
  }
}
