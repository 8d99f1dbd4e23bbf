package io.github.cleave.spark;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.batch.BatchSettings;
import io.github.cleave.batch.FileOutcome;
import io.github.cleave.batch.FileTask;
import io.github.cleave.batch.MemoryBudget;
import io.github.cleave.batch.PreparedRun;
import io.github.cleave.cli.BatchFixtures;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.apache.hadoop.conf.Configuration;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The per-file staging on its own, through {@code file:} paths: a file is copied in, segmented and
 * its outputs copied out with the record naming the remote files; a file that cannot be copied is a
 * failed outcome that also deletes a stale remote record.
 */
class StagedFileTest {
  @Test
  void aFileIsCopiedInAndOutAndACopyFailureIsTheFilesFailure(@TempDir Path tmp) throws IOException {
    Path model = BatchFixtures.model(tmp.resolve("model.json"), 128);
    Path in = tmp.resolve("in");
    BatchFixtures.greyImages(in, 1, 128);
    Path out = Files.createDirectories(tmp.resolve("out"));
    Path mirror = tmp.resolve("mirror");
    Path modelCopy = tmp.resolve("model-copy.json");
    BatchSettings s = new BatchSettings(model, in, mirror, null, 1, null, false, false, 0);
    try (PreparedRun run = PreparedRun.prepare(s)) {
      Files.write(modelCopy, run.spec().modelJson());
      FileTask task = FileTask.open(run.spec(), MemoryBudget.of(0), () -> false);
      Staging staging =
          new Staging(
              RemoteFiles.fileUrl(in).toString(),
              RemoteFiles.fileUrl(out).toString(),
              null,
              model.toString(),
              new HadoopConf(new Configuration()));
      StagedFile staged = new StagedFile(staging, modelCopy);
      FileOutcome ok = staged.run(task, "img-00.tif");
      assertThat(ok.failed()).as(ok.message()).isFalse();
      assertThat(ok.reused()).isFalse();
      assertThat(Files.readString(out.resolve("img-00.record.json")))
          .contains("\"path\": \"file:" + in.resolve("img-00.tif") + "\"")
          .contains("\"path\": \"" + model + "\"")
          .doesNotContain("cleave-stage-");
      assertThat(BatchFixtures.hiddenFiles(out)).isEmpty();
      FileOutcome again = staged.run(task, "img-00.tif");
      assertThat(again.reused()).isTrue();
      // recomputed (a retried attempt): a class map of an earlier run with more classes goes
      Files.writeString(out.resolve("img-00.classes.tif"), "an earlier run's class map");
      FileOutcome redone = staged.run(task.overwriting(), "img-00.tif");
      assertThat(redone.failed()).as(redone.message()).isFalse();
      assertThat(redone.reused()).isFalse();
      assertThat(out.resolve("img-00.classes.tif")).doesNotExist();
      assertThat(out.resolve("img-00.record.json")).exists();
      Files.writeString(out.resolve("gone.record.json"), "{}\n");
      FileOutcome gone = staged.run(task, "gone.tif");
      assertThat(gone.failed()).isTrue();
      assertThat(gone.message())
          .startsWith("cannot copy it between")
          .contains("gone.tif does not exist")
          .endsWith("then run again to resume");
      // nothing was uploaded, so an earlier run's record is left as it was (it is deleted only
      // right before new outputs go up)
      assertThat(out.resolve("gone.record.json")).exists();
    }
  }
}
