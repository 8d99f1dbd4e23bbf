package io.github.cleave.batch;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.BadInputException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** Which files a folder run takes, in which order, and which folders it refuses. */
class InputScanTest {

  @Test
  void extensionsMatchInAnyCaseAndHiddenSeedAndOtherFilesAreSkipped(@TempDir Path tmp)
      throws IOException {
    Path in = Files.createDirectories(tmp.resolve("in"));
    for (String n :
        List.of(
            "b.TIF",
            "a.tif",
            "c.Png",
            "d.tiff",
            ".hidden.tif",
            "._a.tif",
            "a.seeds.tif",
            "notes.txt",
            "e.jpg")) {
      Files.writeString(in.resolve(n), "x");
    }
    Files.createDirectories(in.resolve("sub.tif")); // a folder is never an input
    List<String> found = relatives(scan(in, tmp.resolve("out"), null, false));
    assertThat(found).containsExactly("a.tif", "b.TIF", "c.Png", "d.tiff");
    assertThat(relatives(scan(in, tmp.resolve("out"), "*.TIF", false)))
        .containsExactly("a.tif", "b.TIF");
  }

  @Test
  void recursiveRunsMirrorSubfoldersSkipTheOutputFolderAndSortByPath(@TempDir Path tmp)
      throws IOException {
    Path in = Files.createDirectories(tmp.resolve("in"));
    Path out = in.resolve("results");
    for (String n : List.of("z.tif", "b/x.tif", "a/x.tif", "a/b/y.png", ".git/h.tif")) {
      Path p = in.resolve(n);
      Files.createDirectories(p.getParent());
      Files.writeString(p, "x");
    }
    Files.createDirectories(out);
    Files.writeString(out.resolve("x.mask.tif"), "x");
    List<InputScan.InputFile> files = scan(in, out, null, true);
    assertThat(relatives(files)).containsExactly("a/b/y.png", "a/x.tif", "b/x.tif", "z.tif");
    assertThat(files.get(0).outDir(out)).isEqualTo(out.resolve("a/b"));
    assertThat(files.get(3).outDir(out)).isEqualTo(out);
    assertThat(relatives(scan(in, out, null, false))).containsExactly("z.tif");
    assertThat(relatives(scan(in, out, "a/*.tif", true))).containsExactly("a/x.tif");
  }

  @Test
  void theOrderIsTheSortedRelativePathsWhateverTheCreationOrder(@TempDir Path tmp)
      throws IOException {
    SplittableRandom random = new SplittableRandom(42);
    for (int round = 0; round < 20; round++) {
      Path in = Files.createDirectories(tmp.resolve("in" + round));
      List<String> names = new ArrayList<>();
      for (int i = 0; i < 12; i++) {
        String n = String.format(Locale.ROOT, "f%03d.tif", random.nextInt(1000));
        if (!names.contains(n)) {
          names.add(n);
          Files.writeString(in.resolve(n), "x");
        }
      }
      List<String> sorted = new ArrayList<>(names);
      sorted.sort(String::compareTo);
      assertThat(relatives(scan(in, tmp.resolve("out"), null, false))).isEqualTo(sorted);
    }
  }

  @Test
  void clashesEmptyFoldersAndTheInputFolderAsOutputAreRefused(@TempDir Path tmp)
      throws IOException {
    Path in = Files.createDirectories(tmp.resolve("in"));
    assertThatThrownBy(() -> scan(in, tmp.resolve("out"), null, false))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("no file matching");
    Files.writeString(in.resolve("a.tif"), "x");
    Files.writeString(in.resolve("A.png"), "x");
    assertThatThrownBy(() -> scan(in, tmp.resolve("out"), null, false))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("A.png")
        .hasMessageContaining("a.tif");
    assertThatThrownBy(() -> scan(in, in, "*.tif", false))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("is the input folder");
    assertThatThrownBy(() -> scan(tmp.resolve("missing"), tmp.resolve("out"), null, false))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("does not exist");
  }

  private static List<InputScan.InputFile> scan(
      Path in, Path out, String pattern, boolean recursive) throws IOException {
    return InputScan.scan(
        new BatchSettings(Path.of("m.json"), in, out, null, 1, pattern, recursive, false, 0));
  }

  private static List<String> relatives(List<InputScan.InputFile> files) {
    return files.stream().map(InputScan.InputFile::relative).toList();
  }
}
