package io.github.cleave.cli;

import io.github.cleave.io.ModelFiles;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.stream.Stream;

/**
 * Generated folders and a model for the folder-run tests (local and cluster); every image is a
 * seeded phantom.
 */
public final class BatchFixtures {
  private BatchFixtures() {}

  /** Learns a model from a grey nuclei phantom and writes it to {@code file}. */
  public static Path model(Path file, int size) throws IOException {
    Phantom p = SamplePhantoms.nuclei(900, size, size);
    SegmentationModel m = Segmenter.learn(p.image(), p.seeds(), SegmentationSettings.defaults());
    ModelFiles.write(file, m);
    return file;
  }

  /**
   * Writes {@code count} grey phantoms {@code img-NN.tif} (seeded {@code 100 + NN}) into {@code
   * dir}, without their seed and truth files, and returns their names.
   */
  public static List<String> greyImages(Path dir, int count, int size) throws IOException {
    Files.createDirectories(dir);
    Path scratch = Files.createTempDirectory(dir.getParent(), "phantoms");
    List<String> names = new ArrayList<>();
    for (int i = 0; i < count; i++) {
      String name = String.format(java.util.Locale.ROOT, "img-%02d", i);
      SampleWriter.write(SamplePhantoms.nuclei(100 + i, size, size), scratch, name);
      Files.move(scratch.resolve(name + ".tif"), dir.resolve(name + ".tif"));
      names.add(name);
    }
    deleteTree(scratch);
    return names;
  }

  /**
   * The folder of good and unusable files the batch tests share, written to {@code in} (scratch
   * files go beside it): four grey phantoms {@code img-00..03.tif} of {@code size²}, a corrupt TIFF
   * (header overwritten by seeded random bytes), a text file named {@code .tif}, an RGB image
   * (wrong channel count for a grey model), an empty file and a hidden {@code ._} copy. Returns the
   * good files' names without extension.
   */
  public static List<String> mixedFolder(Path in, int size) throws IOException {
    List<String> good = greyImages(in, 4, size);
    Files.copy(in.resolve("img-00.tif"), in.resolve("corrupt.tif"));
    try (RandomAccessFile f = new RandomAccessFile(in.resolve("corrupt.tif").toFile(), "rw")) {
      byte[] junk = new byte[64];
      new SplittableRandom(5).nextBytes(junk);
      f.seek(4);
      f.write(junk);
    }
    Files.writeString(in.resolve("notes.tif"), "this is a text file, not an image\n");
    Path scratch = Files.createTempDirectory(in.getParent(), "rgb");
    SampleWriter.write(SamplePhantoms.stained(7, size, size), scratch, "colour");
    Files.move(scratch.resolve("colour.tif"), in.resolve("colour.tif"));
    deleteTree(scratch);
    Files.createFile(in.resolve("empty.tif"));
    Files.copy(in.resolve("img-01.tif"), in.resolve("._img-01.tif"));
    return good;
  }

  public static void deleteTree(Path dir) throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      for (Path p : s.sorted((a, b) -> b.compareTo(a)).toList()) {
        Files.delete(p);
      }
    }
  }

  /** The lines of a CSV with the given column (0-based) removed. */
  public static List<String> withoutColumn(Path csv, int column) throws IOException {
    List<String> out = new ArrayList<>();
    for (String line : Files.readAllLines(csv)) {
      List<String> fields = new ArrayList<>(List.of(line.split(",", -1)));
      fields.remove(column);
      out.add(String.join(",", fields));
    }
    return out;
  }

  /** Names of hidden files ({@code .NAME}) in {@code dir} and below. */
  public static List<String> hiddenFiles(Path dir) throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      return s.filter(Files::isRegularFile)
          .map(p -> p.getFileName().toString())
          .filter(n -> n.startsWith("."))
          .toList();
    }
  }
}
