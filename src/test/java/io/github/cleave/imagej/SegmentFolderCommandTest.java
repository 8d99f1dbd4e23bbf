package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.batch.BatchResult;
import io.github.cleave.batch.BatchSettings;
import io.github.cleave.io.TimeAxis;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** {@code Segment Folder...} with macro options: the folder runner's outputs, failures isolated. */
class SegmentFolderCommandTest {
  @Test
  void folderRunWritesEveryOutputAndLogsInsteadOfThrowing(@TempDir Path tmp) throws Exception {
    Path samples = Path.of("sample-images");
    Path in = Files.createDirectories(tmp.resolve("in"));
    Path out = tmp.resolve("out");
    Path model = tmp.resolve("model.json");
    Files.copy(samples.resolve("nuclei.tif"), in.resolve("a.tif"));
    // an RGB image fails against a one-channel model, alone
    Files.copy(
        samples.resolve("stained.tif"), in.resolve("b.tif"), StandardCopyOption.REPLACE_EXISTING);
    assertThat(
            SegmentCommandsInImageJTest.cli(
                "learn",
                "--image",
                samples.resolve("nuclei.tif").toString(),
                "--seeds",
                samples.resolve("nuclei.seeds.tif").toString(),
                "--model",
                model.toString()))
        .isZero();
    String options = "model=[" + model + "] input=[" + in + "] output=[" + out + "] threads=1";
    BatchResult r =
        MacroThread.call(
            options,
            null,
            () ->
                SegmentFolderCommand.run(
                    SegmentFolderCommand.settings(
                        SegmentFolderCommand.form().read(null, SegmentFolderCommand::settings))));
    assertThat(r.files()).hasSize(2);
    assertThat(r.failedCount()).isEqualTo(1);
    assertThat(SegmentFolderCommand.describe(r))
        .contains("b.tif failed: ", "folder done: 2 file(s), 1 failed");
    for (String name : new String[] {"a.mask.tif", "a.labels.tif", "files.csv", "run.json"}) {
      assertThat(out.resolve(name)).exists();
    }
    // the whole menu entry: a second run keeps the complete outputs and throws nothing
    MacroThread.call(
        options,
        null,
        () -> {
          new CommandGate().run("SegmentFolderCommand");
          return null;
        });
    assertThat(out.resolve("run.json")).exists();
  }

  @Test
  void timeSettingsReachTheFolderRun(@TempDir Path tmp) throws Exception {
    String base = "model=[m.json] input=[" + tmp + "] output=[" + tmp.resolve("out") + "]";
    BatchSettings defaults =
        MacroThread.call(
            base + " threads=1",
            null,
            () ->
                SegmentFolderCommand.settings(
                    SegmentFolderCommand.form().read(null, SegmentFolderCommand::settings)));
    assertThat(defaults.timeAxis()).isEqualTo(TimeAxis.AUTO);
    assertThat(defaults.seedFrame()).isZero();
    BatchSettings chosen =
        MacroThread.call(
            base + " threads=1 time=[slices are z planes] seed_frame=3",
            null,
            () ->
                SegmentFolderCommand.settings(
                    SegmentFolderCommand.form().read(null, SegmentFolderCommand::settings)));
    assertThat(chosen.timeAxis()).isEqualTo(TimeAxis.SLICES_ARE_Z);
    assertThat(chosen.seedFrame()).isEqualTo(2);
    assertThat(chosen.seedsFromNeighbour()).isFalse(); // a macro turns a checkbox on by its key
  }
}
