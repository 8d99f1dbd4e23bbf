package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import ij.ImagePlus;
import ij.ImageStack;
import ij.gui.Line;
import ij.gui.OvalRoi;
import ij.gui.PolygonRoi;
import ij.gui.Roi;
import ij.io.RoiEncoder;
import ij.process.ByteProcessor;
import ij.process.ImageProcessor;
import ij.process.ShortProcessor;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.SeedLabels;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;
import java.util.zip.ZipEntry;
import java.util.zip.ZipOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SeedFilesTest {
  @TempDir Path dir;

  @Test
  void labelImagesRoundTripIn8And16BitTiffAndPng() {
    SplittableRandom random = new SplittableRandom(21);
    for (int trial = 0; trial < 6; trial++) {
      int w = 3 + random.nextInt(10);
      int h = 3 + random.nextInt(10);
      int d = trial % 3 == 2 ? 1 + random.nextInt(4) : 1;
      boolean sixteen = trial % 2 == 1;
      ImageStack stack = new ImageStack(w, h);
      byte[] expected = new byte[w * h * d];
      for (int z = 0; z < d; z++) {
        ImageProcessor ip = sixteen ? new ShortProcessor(w, h) : new ByteProcessor(w, h);
        for (int i = 0; i < w * h; i++) {
          int v = random.nextInt(5) == 0 ? random.nextInt(256) : random.nextInt(3);
          ip.set(i % w, i / w, v);
          expected[z * w * h + i] = (byte) v;
        }
        stack.addSlice(null, ip);
      }
      ImagePlus imp = new ImagePlus("seeds", stack);
      boolean png = d == 1 && trial < 2;
      Path file = dir.resolve("s" + trial + (png ? ".seeds.png" : ".seeds.tif"));
      if (png) {
        TestImages.savePng(imp, file);
      } else {
        TestImages.saveTiff(imp, file);
      }

      SeedLabels seeds = SeedFiles.read(file, w, h, d);

      assertThat(seeds.labels()).isEqualTo(expected);
    }
  }

  @Test
  void wrongSizeNamesBothSizes() {
    Path file =
        TestImages.saveTiff(new ImagePlus("s", new ByteProcessor(10, 8)), dir.resolve("a.tif"));
    assertThatThrownBy(() -> SeedFiles.read(file, 12, 8, 1))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("a.tif")
        .hasMessageContaining("10 x 8 x 1")
        .hasMessageContaining("12 x 8 x 1");
    assertThatThrownBy(() -> SeedFiles.read(file, 10, 8, 3)).hasMessageContaining("10 x 8 x 3");
  }

  @Test
  void valuesAbove255AreRefused() {
    ShortProcessor sp = new ShortProcessor(4, 4);
    sp.set(2, 1, 300);
    Path file = TestImages.saveTiff(new ImagePlus("s", sp), dir.resolve("big.tif"));
    assertThatThrownBy(() -> SeedFiles.read(file, 4, 4, 1))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("value 300 at x=2, y=1");
  }

  @Test
  void roiZipRasterisesLinesWithTheirWidthAndFillsAreas() throws IOException {
    Line wide = new Line(5, 10, 25, 10); // horizontal, width 3
    wide.setStrokeWidth(3);
    wide.setName("foreground-1");
    PolygonRoi polyline =
        new PolygonRoi(new float[] {30, 40, 40}, new float[] {5, 5, 20}, Roi.POLYLINE);
    polyline.setName("FG stroke");
    OvalRoi oval = new OvalRoi(5, 25, 10, 8);
    oval.setName("bg");
    Roi rect = new Roi(30, 30, 6, 4);
    rect.setName("class3 debris");
    Path zip = writeZip("r.seeds.zip", wide, polyline, oval, rect);

    SeedLabels seeds = SeedFiles.read(zip, 50, 40, 1);

    // Width: a horizontal line ROI of width 3 covers exactly 3 rows. This is a check against
    // ImageJ's own rasterisation of wide lines (Roi.drawPixels), not an independent source.
    int[] rows = new int[40];
    for (int i = 0; i < 50 * 30; i++) {
      if (seeds.label(i) == 1 && i % 50 < 27) {
        rows[i / 50]++;
      }
    }
    assertThat(java.util.stream.IntStream.of(rows).filter(c -> c > 0).count()).isEqualTo(3);
    assertThat(rows[9]).isPositive();
    assertThat(rows[10]).isPositive();
    assertThat(rows[11]).isPositive();
    // The polyline of width 1 covers both of its segments.
    assertThat(seeds.label(35 + 50 * 5)).isEqualTo(1);
    assertThat(seeds.label(40 + 50 * 15)).isEqualTo(1);
    // Areas: exactly the pixels of ImageJ's own masks (the mask is computed by the ROI, the seed
    // by filling the processor: two routes through ImageJ that must agree).
    assertThat(countLabel(seeds, 2)).isEqualTo(maskCount(oval));
    assertThat(countLabel(seeds, 3)).isEqualTo(24);
    assertThat(seeds.label(30 + 50 * 30)).isEqualTo(3);
    assertThat(seeds.label(35 + 50 * 33)).isEqualTo(3);
    assertThat(seeds.label(36 + 50 * 33)).isEqualTo(0);
  }

  @Test
  void unknownRoiNameIsAnErrorListingThePrefixes() throws IOException {
    Roi a = new Roi(1, 1, 2, 2);
    a.setName("fg");
    Roi b = new Roi(3, 3, 2, 2);
    b.setName("nucleus");
    Path zip = writeZip("u.zip", a, b);
    assertThatThrownBy(() -> SeedFiles.read(zip, 10, 10, 1))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("'nucleus'")
        .hasMessageContaining("foreground or fg")
        .hasMessageContaining("background or bg")
        .hasMessageContaining("classN");
  }

  @Test
  void laterRoisWinWhereTheyOverlap() throws IOException {
    Roi fg = new Roi(0, 0, 6, 6);
    fg.setName("foreground");
    Roi bg = new Roi(3, 3, 6, 6);
    bg.setName("background");
    SeedLabels seeds = SeedFiles.read(writeZip("o.zip", fg, bg), 10, 10, 1);
    assertThat(seeds.label(4 + 10 * 4)).isEqualTo(2);
    assertThat(seeds.label(1 + 10 * 1)).isEqualTo(1);
  }

  @Test
  void stackRoisMarkTheirSliceAndNeedOne() throws IOException {
    Roi onTwo = new Roi(1, 1, 2, 2);
    onTwo.setName("fg");
    onTwo.setPosition(2);
    SeedLabels seeds = SeedFiles.read(writeZip("z.zip", onTwo), 5, 5, 3);
    assertThat(seeds.label(1 + 5 * 1 + 25)).isEqualTo(1);
    assertThat(countLabel(seeds, 1)).isEqualTo(4);

    Roi hyper = new Roi(0, 0, 1, 1);
    hyper.setName("bg");
    hyper.setPosition(1, 3, 1);
    assertThat(SeedFiles.read(writeZip("h.zip", hyper), 5, 5, 3).label(50)).isEqualTo(2);

    Roi none = new Roi(1, 1, 2, 2);
    none.setName("fg");
    Path zip = writeZip("n.zip", none);
    assertThatThrownBy(() -> SeedFiles.read(zip, 5, 5, 3))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("no slice position");
    assertThat(SeedFiles.read(zip, 5, 5, 1).label(6)).isEqualTo(1);
  }

  @Test
  void roiOutsideTheImageAndBrokenZipsAreErrors() throws IOException {
    Roi far = new Roi(100, 100, 3, 3);
    far.setName("fg");
    Path outside = writeZip("far.zip", far);
    assertThatThrownBy(() -> SeedFiles.read(outside, 10, 10, 1))
        .hasMessageContaining("marks no pixel");
    Path junk = Files.writeString(dir.resolve("junk.zip"), "not a zip");
    assertThatThrownBy(() -> SeedFiles.read(junk, 10, 10, 1))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("junk.zip");
  }

  @Test
  void findLooksInTheSeedsFolderThenNextToTheImage() throws IOException {
    Path images = Files.createDirectory(dir.resolve("images"));
    Path seedsDir = Files.createDirectory(dir.resolve("seeds"));
    Path image = Files.createFile(images.resolve("cell.01.tif"));
    assertThat(SeedFiles.find(image, seedsDir)).isEmpty();

    Path beside = Files.createFile(images.resolve("cell.01.seeds.png"));
    assertThat(SeedFiles.find(image, seedsDir)).contains(beside);
    assertThat(SeedFiles.find(image, null)).contains(beside);

    Path inFolder = Files.createFile(seedsDir.resolve("cell.01.seeds.zip"));
    assertThat(SeedFiles.find(image, seedsDir)).contains(inFolder);

    Files.createFile(images.resolve("cell.01.seeds.tif"));
    assertThatThrownBy(() -> SeedFiles.find(image, null))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("several seed files");
  }

  private Path writeZip(String name, Roi... rois) throws IOException {
    Path file = dir.resolve(name);
    try (OutputStream out = Files.newOutputStream(file);
        ZipOutputStream zip = new ZipOutputStream(out)) {
      for (int i = 0; i < rois.length; i++) {
        zip.putNextEntry(new ZipEntry(String.format("%04d.roi", i)));
        zip.write(RoiEncoder.saveAsByteArray(rois[i]));
        zip.closeEntry();
      }
    }
    return file;
  }

  private static long countLabel(SeedLabels seeds, int label) {
    long n = 0;
    for (int i = 0; i < seeds.size(); i++) {
      if (seeds.label(i) == label) {
        n++;
      }
    }
    return n;
  }

  private static long maskCount(Roi roi) {
    ImageProcessor mask = roi.getMask();
    long n = 0;
    for (int i = 0; i < mask.getPixelCount(); i++) {
      if (mask.get(i) != 0) {
        n++;
      }
    }
    return n;
  }
}
