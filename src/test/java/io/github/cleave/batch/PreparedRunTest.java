package io.github.cleave.batch;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.cli.BatchFixtures;
import io.github.cleave.image.BadInputException;
import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The three phases of a folder run through their public API, as a distributed engine calls them:
 * prepare on a driver, the per-file function opened from a serialised {@link RunSpec} with its
 * outcomes serialised back, finish with thumbnails read back from the overlays; the same outputs as
 * {@link BatchRunner}.
 */
class PreparedRunTest {
  static final int SIZE = 128;

  @TempDir static Path shared;
  static Path model;
  static Path in;

  @BeforeAll
  static void folder() throws IOException {
    model = BatchFixtures.model(shared.resolve("model.json"), SIZE);
    in = shared.resolve("in");
    BatchFixtures.mixedFolder(in, SIZE);
  }

  @Test
  void phasesCalledOneByOneWithSerialisedValuesWriteWhatTheRunnerWrites(@TempDir Path tmp)
      throws Exception {
    Path local = tmp.resolve("local");
    BatchResult expected =
        new BatchRunner(settings(local, false).withThreads(2), BatchListener.NONE).run();
    Path phased = tmp.resolve("phased");
    BatchResult result;
    try (PreparedRun run = PreparedRun.prepare(settings(phased, false))) {
      RunSpec shipped = roundTrip(run.spec());
      FileTask task = FileTask.open(shipped, MemoryBudget.of(0), () -> false);
      List<FileOutcome> outcomes = new ArrayList<>();
      for (String file : run.files()) {
        outcomes.add(roundTrip(task.run(file)));
      }
      result = run.finish(outcomes, 2);
    }
    assertThat(result.files())
        .extracting(FileOutcome::file, FileOutcome::status, FileOutcome::message)
        .isEqualTo(
            expected.files().stream()
                .map(f -> org.assertj.core.groups.Tuple.tuple(f.file(), f.status(), f.message()))
                .toList());
    assertThat(names(phased)).isEqualTo(names(local));
    for (String name : names(local)) {
      if (name.endsWith(".record.json") || name.startsWith("run")) {
        continue; // timings and times
      }
      if (name.equals("files.csv")) {
        assertThat(BatchFixtures.withoutColumn(phased.resolve(name), 3))
            .isEqualTo(BatchFixtures.withoutColumn(local.resolve(name), 3));
        continue;
      }
      assertThat(Files.readAllBytes(phased.resolve(name)))
          .as(name)
          .isEqualTo(Files.readAllBytes(local.resolve(name)));
    }
  }

  @Test
  void aPreparedRunHoldsTheFolderAndFinishWantsOneOutcomePerFileInOrder(@TempDir Path tmp)
      throws Exception {
    Path out = tmp.resolve("out");
    try (PreparedRun run = PreparedRun.prepare(settings(out, false))) {
      assertThatThrownBy(() -> PreparedRun.prepare(settings(out, false)))
          .isInstanceOf(BadInputException.class)
          .hasMessageContaining("another run is writing");
      FileTask task = FileTask.open(run.spec(), MemoryBudget.of(0), () -> false);
      List<FileOutcome> outcomes = new ArrayList<>();
      for (String file : run.files()) {
        outcomes.add(task.run(file));
      }
      assertThatThrownBy(() -> run.finish(outcomes.subList(1, outcomes.size()), 1))
          .isInstanceOf(IllegalArgumentException.class)
          .hasMessageContaining("one per file");
      List<FileOutcome> swapped = new ArrayList<>(outcomes);
      swapped.set(0, outcomes.get(1));
      swapped.set(1, outcomes.get(0));
      assertThatThrownBy(() -> run.finish(swapped, 1))
          .isInstanceOf(IllegalArgumentException.class)
          .hasMessageContaining("run order");
      // complete outputs are kept, unless the function is told to overwrite
      String good = "img-00.tif";
      assertThat(task.run(good).reused()).isTrue();
      assertThat(task.overwriting().run(good).reused()).isFalse();
      assertThat(run.finish(outcomes, 1).failedCount()).isEqualTo(4);
    }
    try (PreparedRun again = PreparedRun.prepare(settings(out, false))) {
      assertThat(again.files()).hasSize(8);
    }
  }

  @Test
  void aListedRunFetchesInputsOnlyForTheRangesAndItsTaskRunsOnCopies(@TempDir Path tmp)
      throws Exception {
    Path scanned = tmp.resolve("scanned");
    List<String> files;
    String startedRanges;
    try (PreparedRun run = PreparedRun.prepare(settings(scanned, false))) {
      files = run.files();
      startedRanges = ranges(scanned.resolve("run.started.json"));
    }
    Path mirrorIn = Files.createDirectories(tmp.resolve("mirror-in"));
    Path listed = tmp.resolve("listed");
    BatchSettings s = new BatchSettings(model, mirrorIn, listed, null, 1, null, false, false, 0);
    assertThatThrownBy(() -> PreparedRun.prepareListed(s, List.of("b.tif", "a.tif"), in::resolve))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("sorted");
    List<String> fetched = new ArrayList<>();
    try (PreparedRun run =
        PreparedRun.prepareListed(
            s,
            files,
            rel -> {
              fetched.add(rel);
              return in.resolve(rel);
            })) {
      assertThat(run.files()).isEqualTo(files);
      // run order: colour (wrong channels), corrupt, empty, then the first usable image
      assertThat(fetched).containsExactly("colour.tif", "corrupt.tif", "empty.tif", "img-00.tif");
      assertThat(ranges(listed.resolve("run.started.json"))).isEqualTo(startedRanges);
      // the task on a copy of one input laid out as the run's gives the scanned run's outputs
      Path copyIn = Files.createDirectories(tmp.resolve("copy-in"));
      Path copyOut = tmp.resolve("copy-out");
      Path copyModel = Files.write(tmp.resolve("copy-model.json"), run.spec().modelJson());
      Files.copy(in.resolve("img-01.tif"), copyIn.resolve("img-01.tif"));
      FileTask task =
          FileTask.open(run.spec(), MemoryBudget.of(0), () -> false)
              .at(copyModel, copyIn, copyOut, null);
      assertThat(task.run("img-01.tif").failed()).isFalse();
      try (PreparedRun plain = PreparedRun.prepare(settings(tmp.resolve("plain"), false))) {
        FileTask.open(plain.spec(), MemoryBudget.of(0), () -> false).run("img-01.tif");
      }
      for (String suffix : List.of(".mask.tif", ".labels.tif", ".objects.csv", ".overlay.png")) {
        assertThat(Files.readAllBytes(copyOut.resolve("img-01" + suffix)))
            .as(suffix)
            .isEqualTo(Files.readAllBytes(tmp.resolve("plain").resolve("img-01" + suffix)));
      }
      assertThat(Files.readString(copyOut.resolve("img-01.record.json")))
          .contains(copyIn.resolve("img-01.tif").toString(), copyModel.toString());
    }
  }

  private static String ranges(Path started) throws IOException {
    return com.google.gson.JsonParser.parseString(Files.readString(started))
        .getAsJsonObject()
        .get("displayRanges")
        .toString();
  }

  private static BatchSettings settings(Path out, boolean overwrite) {
    return new BatchSettings(model, in, out, null, 1, null, false, overwrite, 0);
  }

  @SuppressWarnings("unchecked")
  private static <T> T roundTrip(T value) throws IOException, ClassNotFoundException {
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    try (ObjectOutputStream o = new ObjectOutputStream(bytes)) {
      o.writeObject(value);
    }
    try (ObjectInputStream i =
        new ObjectInputStream(new ByteArrayInputStream(bytes.toByteArray()))) {
      return (T) i.readObject();
    }
  }

  private static List<String> names(Path dir) throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      return s.filter(Files::isRegularFile)
          .map(p -> dir.relativize(p).toString())
          .sorted()
          .toList();
    }
  }
}
