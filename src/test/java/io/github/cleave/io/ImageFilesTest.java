package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.CompositeImage;
import ij.ImagePlus;
import ij.io.FileSaver;
import ij.process.ByteProcessor;
import ij.process.ColorProcessor;
import ij.process.FloatProcessor;
import ij.process.ShortProcessor;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.awt.image.BufferedImage;
import java.awt.image.IndexColorModel;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.SplittableRandom;
import javax.imageio.ImageIO;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

class ImageFilesTest {
  @TempDir Path dir;

  @ParameterizedTest
  @ValueSource(ints = {8, 16, 24, 32})
  void tiffRoundTripKeepsRawValuesAndCalibration(int bitDepth) {
    SplittableRandom random = new SplittableRandom(bitDepth);
    ImagePlus imp = TestImages.randomImage(bitDepth, 17, 11, 1, 1, random);
    imp.setCalibration(TestImages.microns(0.25, 0.5, 1));
    Path file = TestImages.saveTiff(imp, dir.resolve("img" + bitDepth + ".tif"));

    LoadedImage loaded = ImageFiles.read(file);

    Raster r = loaded.raster();
    assertThat(r.width()).isEqualTo(17);
    assertThat(r.height()).isEqualTo(11);
    assertThat(r.depth()).isEqualTo(1);
    assertThat(loaded.bitDepth()).isEqualTo(bitDepth);
    assertThat(loaded.source()).isEqualTo(file);
    assertThat(r.voxelSize()).isEqualTo(new VoxelSize(0.25, 0.5, 1, "micron", false));
    assertSameValues(imp, r, 1, 1);
    PixelKind expected =
        bitDepth == 8
            ? PixelKind.GREY8
            : bitDepth == 16
                ? PixelKind.GREY16
                : bitDepth == 24 ? PixelKind.RGB : PixelKind.FLOAT32;
    assertThat(r.kind()).isEqualTo(expected);
    assertThat(r.channelCount()).isEqualTo(bitDepth == 24 ? 3 : 1);
  }

  @ParameterizedTest
  @ValueSource(ints = {8, 16, 24})
  void pngRoundTripKeepsRawValuesWithoutCalibration(int bitDepth) {
    ImagePlus imp = TestImages.randomImage(bitDepth, 13, 9, 1, 1, new SplittableRandom(7));
    Path file = TestImages.savePng(imp, dir.resolve("img" + bitDepth + ".png"));

    LoadedImage loaded = ImageFiles.read(file);

    assertSameValues(imp, loaded.raster(), 1, 1);
    assertThat(loaded.raster().voxelSize()).isEqualTo(VoxelSize.PIXELS);
    if (bitDepth == 24) {
      assertThat(loaded.channelNames()).containsExactly("red", "green", "blue");
    }
  }

  @Test
  void compositeWithTwoChannelsAndThreeSlicesBecomesTwoChannelsOfAStack() {
    ImagePlus plain = TestImages.randomImage(16, 8, 6, 2, 3, new SplittableRandom(3));
    plain.getStack().setSliceLabel("DAPI", 1);
    plain.getStack().setSliceLabel("GFP", 2);
    CompositeImage imp = new CompositeImage(plain, CompositeImage.COMPOSITE);
    imp.setCalibration(TestImages.microns(0.2, 0.2, 0.8));
    Path file = TestImages.saveTiff(imp, dir.resolve("composite.tif"));

    LoadedImage loaded = ImageFiles.read(file);

    Raster r = loaded.raster();
    assertThat(r.channelCount()).isEqualTo(2);
    assertThat(r.depth()).isEqualTo(3);
    assertThat(r.voxelSize()).isEqualTo(new VoxelSize(0.2, 0.2, 0.8, "micron", false));
    assertThat(loaded.channelNames()).containsExactly("DAPI", "GFP");
    assertSameValues(plain, r, 2, 3);
  }

  @Test
  void singleChannelStackKeepsEveryPlane() {
    ImagePlus imp = TestImages.randomImage(8, 5, 4, 1, 7, new SplittableRandom(11));
    Path file = TestImages.saveTiff(imp, dir.resolve("stack.tif"));
    Raster r = ImageFiles.read(file).raster();
    assertThat(r.depth()).isEqualTo(7);
    assertSameValues(imp, r, 1, 7);
  }

  @Test
  void narrowDisplayRangeDoesNotChangeRawValues() {
    short[] values = new short[64];
    for (int i = 0; i < values.length; i++) {
      values[i] = (short) (i * 1000);
    }
    ImagePlus imp = new ImagePlus("narrow", new ShortProcessor(8, 8, values, null));
    imp.setDisplayRange(100, 200);
    Path file = TestImages.saveTiff(imp, dir.resolve("narrow.tif"));

    float[] read = ImageFiles.read(file).raster().channel(0);

    for (int i = 0; i < values.length; i++) {
      assertThat(read[i]).isEqualTo(i * 1000f);
    }
  }

  @Test
  void invertingLutKeepsRawValuesAndIsReported() {
    ByteProcessor ip = (ByteProcessor) TestImages.randomPlane(8, 6, 6, new SplittableRandom(5));
    ip.invertLut();
    ImagePlus imp = new ImagePlus("inverted", ip);
    Path file = TestImages.saveTiff(imp, dir.resolve("inverted.tif"));

    LoadedImage loaded = ImageFiles.read(file);

    assertThat(loaded.invertedLut()).isTrue();
    assertSameValues(imp, loaded.raster(), 1, 1);
  }

  @Test
  void zippedTiffIsRead() {
    ImagePlus imp = TestImages.randomImage(16, 6, 5, 1, 1, new SplittableRandom(9));
    Path file = dir.resolve("zipped.zip");
    assertThat(new FileSaver(imp).saveAsZip(file.toString())).isTrue();
    assertSameValues(imp, ImageFiles.read(file).raster(), 1, 1);
  }

  @Test
  void timeLapseIsRefusedWithTheNumberOfTimePoints() {
    ImagePlus imp = TestImages.randomImage(8, 4, 4, 1, 1, new SplittableRandom(1));
    ImagePlus movie = TestImages.randomImage(8, 4, 4, 1, 12, new SplittableRandom(1));
    movie.setDimensions(1, 1, 12);
    Path file = TestImages.saveTiff(movie, dir.resolve("movie.tif"));
    assertThat(imp.getNFrames()).isEqualTo(1);

    assertThatThrownBy(() -> ImageFiles.read(file))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("movie.tif")
        .hasMessageContaining("12 time points")
        .hasMessageContaining("one time point at a time");
    assertThatThrownBy(() -> ImageFiles.fromImagePlus(movie, "movie"))
        .hasMessageContaining("12 time points");
  }

  @Test
  void indexedColourPngIsRefusedWithAdviceToConvert() throws IOException {
    byte[] r = new byte[256];
    byte[] g = new byte[256];
    byte[] b = new byte[256];
    // A palette that jumps between unrelated colours, as indexed-colour files have.
    SplittableRandom random = new SplittableRandom(6);
    random.nextBytes(r);
    random.nextBytes(g);
    random.nextBytes(b);
    BufferedImage indexed =
        new BufferedImage(
            8, 8, BufferedImage.TYPE_BYTE_INDEXED, new IndexColorModel(8, 256, r, g, b));
    for (int i = 0; i < 64; i++) {
      indexed.getRaster().setSample(i % 8, i / 8, 0, i);
    }
    Path file = dir.resolve("indexed.png");
    assertThat(ImageIO.write(indexed, "png", file.toFile())).isTrue();

    assertThatThrownBy(() -> ImageFiles.read(file))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("indexed.png")
        .hasMessageContaining("convert it to RGB");
  }

  @Test
  void nanAndInfinityAreRefusedWithCountAndFirstPosition() {
    float[] v = new float[5 * 4 * 2];
    v[3 + 5 * 2] = Float.NaN; // x=3, y=2, z=0
    v[1 + 5 * (0 + 4)] = Float.POSITIVE_INFINITY; // x=1, y=0, z=1
    ImagePlus imp = TestImages.randomImage(32, 5, 4, 1, 2, new SplittableRandom(2));
    imp.getStack().setPixels(Arrays.copyOfRange(v, 0, 20), 1);
    imp.getStack().setPixels(Arrays.copyOfRange(v, 20, 40), 2);
    Path file = TestImages.saveTiff(imp, dir.resolve("nan.tif"));

    assertThatThrownBy(() -> ImageFiles.read(file))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("nan.tif")
        .hasMessageContaining("2 NaN or infinite")
        .hasMessageContaining("x=3, y=2, z=0")
        .hasMessageContaining("replace them");
  }

  @Test
  void truncatedTiffIsRefusedWithTheFileName() throws IOException {
    ImagePlus imp = TestImages.randomImage(16, 32, 32, 1, 1, new SplittableRandom(4));
    Path file = TestImages.saveTiff(imp, dir.resolve("cut.tif"));
    byte[] all = Files.readAllBytes(file);
    Files.write(file, Arrays.copyOf(all, all.length / 2));

    assertThatThrownBy(() -> ImageFiles.read(file))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("cut.tif")
        .hasMessageContaining("truncated");
  }

  @Test
  void textEmptyMissingAndGarbageFilesAreRefusedWithTheFileName() throws IOException {
    Path text = Files.writeString(dir.resolve("notes.tif"), "not an image\n");
    Path empty = Files.write(dir.resolve("empty.tif"), new byte[0]);
    Path emptyPng = Files.write(dir.resolve("empty.png"), new byte[0]);
    byte[] junk = new byte[300];
    new SplittableRandom(8).nextBytes(junk);
    Path garbagePng = Files.write(dir.resolve("junk.png"), junk);
    Path missing = dir.resolve("missing.tif");
    Path wrongType = Files.writeString(dir.resolve("table.csv"), "a,b\n");

    for (Path p : new Path[] {text, empty, emptyPng, garbagePng, missing, wrongType}) {
      assertThatThrownBy(() -> ImageFiles.read(p))
          .isInstanceOf(BadInputException.class)
          .hasMessageContaining(p.getFileName().toString())
          .satisfies(e -> assertThat(e.getMessage()).doesNotContain("\n"));
    }
    assertThatThrownBy(() -> ImageFiles.read(empty)).hasMessageContaining("empty");
    assertThatThrownBy(() -> ImageFiles.read(missing)).hasMessageContaining("does not exist");
  }

  @Test
  void memoryCheckSaysHowMuchIsNeededAndSuggestsXmx() {
    assertThatThrownBy(() -> MemoryEstimate.check("big.tif", "1 x 1", 3L << 30, 1L << 30))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("big.tif")
        .hasMessageContaining("3072 MiB")
        .hasMessageContaining("-Xmx");
    MemoryEstimate.check("small.tif", "1 x 1", 1, 2); // fits: no exception
    // 8-bit, 1 channel: 1 byte stored + 4 bytes float + the solver's per-voxel figure.
    assertThat(MemoryEstimate.bytesNeeded(10, 10, 2, 1, 1, 1))
        .isEqualTo(200 * (1 + 4 + MemoryEstimate.SOLVER_BYTES_PER_VOXEL));
  }

  @Test
  void fromImagePlusConvertsAnOpenImage() {
    ImagePlus imp =
        new ImagePlus(
            "open", new ColorProcessor(3, 2, new int[] {0xff0000, 0x00ff00, 0x0000ff, 1, 2, 3}));
    LoadedImage loaded = ImageFiles.fromImagePlus(imp, "open");
    assertThat(loaded.source()).isNull();
    assertThat(loaded.title()).isEqualTo("open");
    assertThat(loaded.raster().channel(0)).containsExactly(255, 0, 0, 0, 0, 0);
    assertThat(loaded.raster().channel(2)).containsExactly(0, 0, 255, 1, 2, 3);
    FloatProcessor fp = new FloatProcessor(2, 1, new float[] {1.5f, -2f});
    assertThat(ImageFiles.fromImagePlus(new ImagePlus("f", fp), "f").raster().channel(0))
        .containsExactly(1.5f, -2f);
  }

  /** Every raw value of {@code imp} (C channels, Z slices) equals the raster's. */
  static void assertSameValues(ImagePlus imp, Raster r, int channels, int slices) {
    int w = r.width();
    int h = r.height();
    for (int c = 0; c < channels; c++) {
      for (int z = 0; z < slices; z++) {
        int index = imp.getStackIndex(c + 1, z + 1, 1);
        for (int y = 0; y < h; y++) {
          for (int x = 0; x < w; x++) {
            int i = x + w * (y + h * z);
            if (imp.getBitDepth() == 24) {
              int rgb = imp.getStack().getProcessor(index).get(x, y);
              assertThat(r.channel(0)[i]).isEqualTo((rgb >> 16) & 0xff);
              assertThat(r.channel(1)[i]).isEqualTo((rgb >> 8) & 0xff);
              assertThat(r.channel(2)[i]).isEqualTo(rgb & 0xff);
            } else {
              assertThat(r.channel(c)[i]).isEqualTo(TestImages.raw(imp, index, x, y));
            }
          }
        }
      }
    }
  }
}
