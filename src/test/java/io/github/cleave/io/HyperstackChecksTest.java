package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.ImagePlus;
import ij.measure.Calibration;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.Arrays;
import java.util.SplittableRandom;
import javax.imageio.IIOImage;
import javax.imageio.ImageIO;
import javax.imageio.ImageWriteParam;
import javax.imageio.ImageWriter;
import javax.imageio.stream.ImageOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Time axis choices, memory per time point and refusals of {@link Hyperstacks}. */
class HyperstackChecksTest {
  @TempDir Path dir;

  private Path stackOfSlices(String name, double frameInterval, double zSpacing, String info) {
    ImagePlus imp = HyperstackImages.hyperstack(8, 6, 5, 1, 4, 1, 31);
    Calibration cal = TestImages.microns(0.5, 0.5, zSpacing);
    cal.frameInterval = frameInterval;
    imp.setCalibration(cal);
    if (info != null) {
      imp.setProperty("Info", info);
    }
    return TestImages.saveTiff(imp, dir.resolve(name));
  }

  @Test
  void slicesWithoutFrameIntervalAreOneVolumeWithoutWarning() {
    OpenedSeries s = Hyperstacks.openSeries(stackOfSlices("plain.tif", 0, 1, null), TimeAxis.AUTO);
    assertThat(s.timeSource()).isEqualTo(OpenedSeries.TimeSource.NONE);
    assertThat(s.frameCount()).isEqualTo(1);
    assertThat(s.depth()).isEqualTo(4);
    assertThat(s.warnings()).isEmpty();
    assertThat(s.frameInterval()).isNaN();
    assertThat(s.timeUnit()).isEqualTo("frame");
  }

  @Test
  void slicesAreFramesForcesTimePointsWithoutInterval() {
    OpenedSeries s =
        Hyperstacks.openSeries(stackOfSlices("forced.tif", 0, 1, null), TimeAxis.SLICES_ARE_FRAMES);
    assertThat(s.timeSource()).isEqualTo(OpenedSeries.TimeSource.SLICES_AS_FRAMES);
    assertThat(s.frameCount()).isEqualTo(4);
    assertThat(s.depth()).isEqualTo(1);
    assertThat(s.frameInterval()).isNaN();
    assertThat(s.reason()).contains("as asked");
    for (int t = 0; t < 4; t++) {
      assertThat(s.frame(t).channel(0)[0]).isEqualTo(t); // pixel 0 of slice t holds its code t
    }
  }

  @Test
  void frameIntervalWithZSpacingStaysAVolumeButWarns() {
    OpenedSeries s = Hyperstacks.openSeries(stackOfSlices("both.tif", 5, 0.7, null), TimeAxis.AUTO);
    assertThat(s.timeSource()).isEqualTo(OpenedSeries.TimeSource.NONE);
    assertThat(s.depth()).isEqualTo(4);
    assertThat(s.voxelSize().z()).isEqualTo(0.7);
    assertThat(s.warnings()).singleElement().asString().contains("both.tif", "slices-are-frames");
  }

  @Test
  void frameIntervalWithADescriptionNamingATimeLapseReadsSlicesAsFrames() {
    OpenedSeries s =
        Hyperstacks.openSeries(
            stackOfSlices("described.tif", 5, 0.7, "Acquired as a time-lapse, 4 frames"),
            TimeAxis.AUTO);
    assertThat(s.timeSource()).isEqualTo(OpenedSeries.TimeSource.SLICES_AS_FRAMES);
    assertThat(s.frameCount()).isEqualTo(4);
    assertThat(s.frameInterval()).isEqualTo(5);
    assertThat(s.timeUnit()).isEqualTo("s");
    assertThat(s.warnings()).singleElement().asString().contains("description");
  }

  @Test
  void realFramesStayFramesWhateverTheAxisSetting() {
    ImagePlus imp = HyperstackImages.hyperstack(8, 4, 4, 1, 2, 3, 41);
    Path file = TestImages.saveTiff(imp, dir.resolve("frames.tif"));
    for (TimeAxis axis : TimeAxis.values()) {
      OpenedSeries s = Hyperstacks.openSeries(file, axis);
      assertThat(s.timeSource()).isEqualTo(OpenedSeries.TimeSource.FRAMES);
      assertThat(s.frameCount()).isEqualTo(3);
      assertThat(s.depth()).isEqualTo(2);
      assertThat(s.warnings()).hasSize(axis == TimeAxis.SLICES_ARE_FRAMES ? 1 : 0);
    }
  }

  @Test
  void memoryIsCheckedPerTimePointNotForTheWholeFile() {
    ImagePlus imp = HyperstackImages.hyperstack(16, 32, 32, 2, 3, 40, 51);
    Path file = TestImages.saveTiff(imp, dir.resolve("long.tif"));
    long perFrame = MemoryEstimate.bytesNeeded(32, 32, 6, 2, 2, 1);
    long whole = ImageFiles.estimateHeapBytes(file);
    long available = 2 * perFrame;
    assertThat(whole).isGreaterThan(available); // the file as a whole would not fit
    ImagePlus opened = ImageOpening.openForSeries(file, "image");
    assertThat(opened.getStack().isVirtual()).isTrue(); // planes stay in the file until asked for
    assertThat(opened.getNFrames()).isEqualTo(40);

    OpenedSeries s = Hyperstacks.openSeries(file, TimeAxis.AUTO, needed -> available);
    assertThat(Hyperstacks.bytesPerTimePoint(s)).isEqualTo(perFrame);
    assertThat(s.frameCount()).isEqualTo(40);
    assertThat(HyperstackImages.firstDifference(imp, s.frame(39), 39, false)).isNull();
    assertThatThrownBy(() -> MemoryEstimate.check("long.tif", "whole", whole, available))
        .isInstanceOf(BadInputException.class);

    assertThatThrownBy(() -> Hyperstacks.openSeries(file, TimeAxis.AUTO, needed -> needed - 1))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("long.tif")
        .hasMessageContaining("per time point")
        .hasMessageContaining("-Xmx");
  }

  @Test
  void nonFiniteValuesAreRefusedForTheirTimePointOnly() {
    ImagePlus imp = HyperstackImages.hyperstack(32, 5, 4, 1, 2, 3, 61);
    imp.getStack().getProcessor(HyperstackImages.index(0, 1, 2, 1, 2)).setf(3, 2, Float.NaN);
    Path file = TestImages.saveTiff(imp, dir.resolve("nan.tif"));
    OpenedSeries s = Hyperstacks.openSeries(file, TimeAxis.AUTO);

    assertThat(s.frame(0).size()).isEqualTo(40);
    assertThat(s.frame(1).size()).isEqualTo(40);
    assertThatThrownBy(() -> s.frame(2))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("time point 3")
        .hasMessageContaining("x=3, y=2, z=1");
  }

  @Test
  void aFileChangedAfterOpeningIsNotReadOn() throws IOException {
    Path file =
        TestImages.saveTiff(
            HyperstackImages.hyperstack(8, 4, 4, 1, 1, 3, 71), dir.resolve("m.tif"));
    OpenedSeries s = Hyperstacks.openSeries(file, TimeAxis.AUTO);
    Raster before = s.frame(1);
    Files.setLastModifiedTime(
        file, FileTime.fromMillis(Files.getLastModifiedTime(file).toMillis() - 60_000));
    assertThatThrownBy(() -> s.frame(1))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("m.tif")
        .hasMessageContaining("open it again");
    assertThat(before.size()).isEqualTo(16);
  }

  @Test
  void badFilesAreRefusedAsTheImageReaderRefusesThem() throws IOException {
    assertThatThrownBy(() -> Hyperstacks.openSeries(dir.resolve("none.tif"), TimeAxis.AUTO))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("does not exist");
    Path file =
        TestImages.saveTiff(
            HyperstackImages.hyperstack(16, 20, 20, 1, 2, 3, 81), dir.resolve("cut.tif"));
    byte[] bytes = Files.readAllBytes(file);
    Path cut = Files.write(dir.resolve("cut2.tif"), Arrays.copyOf(bytes, bytes.length / 2));
    assertThatThrownBy(() -> Hyperstacks.openSeries(cut, TimeAxis.AUTO))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("truncated");
    Path text = Files.writeString(dir.resolve("x.txt"), "hello");
    assertThatThrownBy(() -> Hyperstacks.openSeries(text, TimeAxis.AUTO))
        .hasMessageContaining("unsupported type");
  }

  @Test
  void theImageReaderStillRefusesATimeLapseAndPointsToTheTimeLapseReading() {
    Path file =
        TestImages.saveTiff(
            HyperstackImages.hyperstack(8, 4, 4, 1, 1, 5, 91), dir.resolve("tl.tif"));
    assertThatThrownBy(() -> ImageFiles.read(file))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("5 time points")
        .hasMessageContaining("open it as a time-lapse");
    assertThat(Hyperstacks.openSeries(file, TimeAxis.AUTO).frameCount()).isEqualTo(5);
  }

  @Test
  void pngIsOneTimePoint() {
    ImagePlus imp = TestImages.randomImage(8, 9, 7, 1, 1, new java.util.SplittableRandom(3));
    Path file = TestImages.savePng(imp, dir.resolve("one.png"));
    OpenedSeries s = Hyperstacks.openSeries(file, TimeAxis.AUTO);
    assertThat(s.frameCount()).isEqualTo(1);
    assertThat(s.firstFrame().raster().channel(0))
        .containsExactly(ImageFiles.read(file).raster().channel(0));
  }

  @Test
  void tiffWithOneEntryPerPlaneFromAnotherWriterIsReadPlaneByPlane() throws IOException {
    // Written by the JDK's own TIFF writer: one image entry per page, no ImageJ description.
    SplittableRandom random = new SplittableRandom(101);
    java.util.List<BufferedImage> pages = new java.util.ArrayList<>();
    for (int p = 0; p < 3; p++) {
      BufferedImage page = new BufferedImage(6, 4, BufferedImage.TYPE_BYTE_GRAY);
      for (int y = 0; y < 4; y++) {
        for (int x = 0; x < 6; x++) {
          page.getRaster().setSample(x, y, 0, random.nextInt(256));
        }
      }
      pages.add(page);
    }
    Path file = dir.resolve("pages.tif");
    ImageWriter writer = ImageIO.getImageWritersByFormatName("tiff").next();
    try (ImageOutputStream out = ImageIO.createImageOutputStream(file.toFile())) {
      writer.setOutput(out);
      ImageWriteParam param = writer.getDefaultWriteParam();
      param.setCompressionMode(ImageWriteParam.MODE_EXPLICIT);
      param.setCompressionType("LZW");
      writer.prepareWriteSequence(null);
      for (BufferedImage page : pages) {
        writer.writeToSequence(new IIOImage(page, null, null), param);
      }
      writer.endWriteSequence();
    } finally {
      writer.dispose();
    }

    OpenedSeries s = Hyperstacks.openSeries(file, TimeAxis.SLICES_ARE_FRAMES);
    assertThat(s.frameCount()).isEqualTo(3);
    assertThat(s.voxelSize()).isEqualTo(VoxelSize.PIXELS); // a resolution without a unit name
    assertThat(ImageFiles.read(file).raster().depth()).isEqualTo(3);
    for (int t = 2; t >= 0; t--) {
      float[] values = s.frame(t).channel(0);
      for (int y = 0; y < 4; y++) {
        for (int x = 0; x < 6; x++) {
          assertThat(values[x + 6 * y]).isEqualTo(pages.get(t).getRaster().getSample(x, y, 0));
        }
      }
    }
  }
}
