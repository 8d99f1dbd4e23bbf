package io.github.cleave.spark;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.batch.BatchSettings;
import io.github.cleave.batch.InputNames;
import io.github.cleave.batch.PreparedRun;
import io.github.cleave.cli.BatchFixtures;
import io.github.cleave.image.BadInputException;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.FileSystem;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The listing through Hadoop's file system client against the local scan of {@code batch}, on
 * random folder trees (seeded): the same inputs in the same order, or the same refusal.
 */
class RemoteScanTest {
  private static final List<String> NAMES =
      List.of(
          "a.tif",
          "B.TIF",
          "c.png",
          "d.tiff",
          "e.Png",
          ".hidden.tif",
          "._a.tif",
          "a.seeds.tif",
          "a.truth.png",
          "notes.txt",
          "b.tif",
          "a.png",
          "z 1.tif");
  private static final List<String> FOLDERS = List.of("", "s1", "s1/deep", ".h", "out", "s2");
  private static final List<String> PATTERNS =
      List.of("*.tif", BatchSettings.DEFAULT_PATTERN, "s1/*.tif", "*", "*.{png,tiff}");

  @Test
  void theRemoteListingTakesWhatTheLocalScanTakes(@TempDir Path tmp) throws IOException {
    Path model = BatchFixtures.model(tmp.resolve("model.json"), 128);
    Configuration conf = new Configuration();
    SplittableRandom random = new SplittableRandom(20261203L);
    for (int round = 0; round < 40; round++) {
      Path in = tmp.resolve("in-" + round);
      Files.createDirectories(in);
      int files = 1 + random.nextInt(10);
      for (int i = 0; i < files; i++) {
        Path dir = in.resolve(FOLDERS.get(random.nextInt(FOLDERS.size())));
        Files.createDirectories(dir);
        Files.writeString(dir.resolve(NAMES.get(random.nextInt(NAMES.size()))), "x");
      }
      boolean outInside = random.nextBoolean();
      Path out = outInside ? in.resolve("out") : tmp.resolve("out-" + round);
      String pattern = PATTERNS.get(random.nextInt(PATTERNS.size()));
      boolean recursive = random.nextBoolean();
      BatchSettings s = new BatchSettings(model, in, out, null, 1, pattern, recursive, false, 0);
      String local;
      try (PreparedRun run = PreparedRun.prepare(s)) {
        local = run.files().toString();
      } catch (BadInputException e) {
        local = "refused: " + e.getMessage();
      }
      org.apache.hadoop.fs.Path remoteIn = RemoteFiles.fileUrl(in);
      FileSystem fs = RemoteFiles.fileSystem(remoteIn, conf);
      String remote;
      try {
        InputNames names = InputNames.of(pattern);
        List<String> listed =
            RemoteScan.list(
                fs,
                fs.makeQualified(remoteIn),
                fs.makeQualified(RemoteFiles.fileUrl(out)),
                names,
                recursive);
        names.check(listed, in.toString(), recursive);
        remote = listed.toString();
      } catch (BadInputException e) {
        remote = "refused: " + e.getMessage();
      }
      assertThat(remote)
          .as(
              "round %d: pattern %s, recursive %b, out inside %b",
              round, pattern, recursive, outInside)
          .isEqualTo(local);
    }
  }
}
