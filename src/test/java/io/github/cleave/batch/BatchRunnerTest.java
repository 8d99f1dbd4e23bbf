package io.github.cleave.batch;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.io.ModelFiles;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import io.github.cleave.synth.SampleWriter;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CancellationException;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The runner through its API: heap budget, subfolders, seeds folder, progress, cancellation. */
class BatchRunnerTest {
  @TempDir static Path shared;
  static Path model;

  @BeforeAll
  static void learnModel() throws IOException {
    Phantom p = SamplePhantoms.nuclei(900, 128, 128);
    model = shared.resolve("model.json");
    ModelFiles.write(model, Segmenter.learn(p.image(), p.seeds(), SegmentationSettings.defaults()));
  }

  @Test
  void aFileTooLargeForTheBudgetFailsAloneWithTheMemoryItNeeds(@TempDir Path tmp)
      throws IOException {
    Path in = Files.createDirectories(tmp.resolve("in"));
    SampleWriter.write(SamplePhantoms.nuclei(1, 128, 128), in, "small");
    SampleWriter.write(SamplePhantoms.nuclei(2, 384, 384), in, "large");
    // 128 x 128 needs about 1.1 MB by the estimate of io.MemoryEstimate, 384 x 384 about 9.7 MB
    BatchSettings s =
        new BatchSettings(model, in, tmp.resolve("out"), null, 2, "*.tif", false, false, 3 << 20);
    List<BatchProgress> seen = new ArrayList<>();
    BatchResult r = new BatchRunner(s, seen::add).run();
    assertThat(r.files()).extracting(FileOutcome::file).containsExactly("large.tif", "small.tif");
    assertThat(r.files().get(0).failed()).isTrue();
    assertThat(r.files().get(0).message())
        .contains("large.tif", "too large for the heap", "MiB", "-Xmx");
    assertThat(r.files().get(1).failed()).isFalse();
    assertThat(seen).hasSize(2);
    assertThat(seen.get(1).done()).isEqualTo(2);
    assertThat(seen.get(1).failed()).isEqualTo(1);
  }

  @Test
  void subfoldersAreMirroredAndTheSeedsFolderIsUsed(@TempDir Path tmp) throws IOException {
    Path in = tmp.resolve("in");
    Path seeds = tmp.resolve("seeds");
    Path scratch = Files.createDirectories(tmp.resolve("scratch"));
    Files.createDirectories(in.resolve("day1"));
    Files.createDirectories(in.resolve("day2"));
    Files.createDirectories(seeds.resolve("day2"));
    SampleWriter.write(SamplePhantoms.nuclei(3, 128, 128), scratch, "a");
    Files.copy(scratch.resolve("a.tif"), in.resolve("day1/a.tif"));
    Files.copy(scratch.resolve("a.tif"), in.resolve("day2/a.tif"));
    Files.copy(scratch.resolve("a.seeds.tif"), seeds.resolve("day2/a.seeds.tif"));
    Path out = tmp.resolve("out");
    BatchResult r =
        new BatchRunner(
                new BatchSettings(model, in, out, seeds, 1, null, true, false, 0),
                BatchListener.NONE)
            .run();
    assertThat(r.allSucceeded()).isTrue();
    assertThat(r.files()).extracting(FileOutcome::file).containsExactly("day1/a.tif", "day2/a.tif");
    assertThat(out.resolve("day1/a.mask.tif")).isRegularFile();
    assertThat(out.resolve("day2/a.mask.tif")).isRegularFile();
    assertThat(Files.readString(out.resolve("day1/a.record.json"))).doesNotContain("\"seeds\"");
    assertThat(Files.readString(out.resolve("day2/a.record.json"))).contains("\"seeds\"");
    assertThat(Files.readAllLines(out.resolve("objects.csv")).get(1)).startsWith("day1/a.tif,");
  }

  @Test
  void aCancelledRunStopsAndWritesNoFolderOutput(@TempDir Path tmp) throws IOException {
    Path in = Files.createDirectories(tmp.resolve("in"));
    SampleWriter.write(SamplePhantoms.nuclei(4, 128, 128), in, "a");
    SampleWriter.write(SamplePhantoms.nuclei(5, 128, 128), in, "b");
    Path out = tmp.resolve("out");
    BatchRunner[] runner = new BatchRunner[1];
    runner[0] =
        new BatchRunner(
            new BatchSettings(model, in, out, null, 1, "*.tif", false, false, 0),
            p -> runner[0].cancel()); // stop after the first file
    try {
      runner[0].run();
      throw new AssertionError("a cancelled run must throw");
    } catch (CancellationException expected) {
      // expected
    }
    assertThat(out.resolve("a.record.json")).isRegularFile();
    assertThat(out.resolve("b.record.json")).doesNotExist();
    assertThat(out.resolve("run.json")).doesNotExist();
    assertThat(out.resolve("files.csv")).doesNotExist();
  }
}
