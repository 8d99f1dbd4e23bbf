package io.github.cleave.spark;

import io.github.cleave.batch.FileOutcome;
import io.github.cleave.batch.FileTask;
import io.github.cleave.batch.RunSpec;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.function.FlatMapFunction;
import org.apache.spark.broadcast.Broadcast;

/**
 * The work of one task: opens the per-file function ({@link FileTask}) from the broadcast run
 * values once, then runs it on each file of the partition in order. A file's failure is caught
 * inside {@link FileTask#run} and comes back as a failed outcome, so one bad file never fails the
 * task; only cancellation (the task killed) and errors outside the per-file function end it.
 *
 * <p>A retried attempt ({@code attemptNumber > 0}) recomputes every file of its partition instead
 * of keeping outputs it finds complete: those may be the earlier attempt's, and recomputing simply
 * replaces them, atomically, with the same bytes, so the retried run reports the files as a clean
 * run does and leaves no duplicate.
 *
 * <p>With staging, each file is copied to the executor's disk and its outputs back ({@link
 * StagedFile}), with one local copy of the model per task.
 *
 * <p>{@code failOncePartition} is a test hook: the first attempt of that partition throws after its
 * first file, outside the per-file function; -1 (the default) disables it.
 */
final class PartitionWork implements FlatMapFunction<Iterator<IndexedFile>, IndexedOutcome> {
  private static final long serialVersionUID = 1L;

  private final Broadcast<RunSpec> spec;
  private final Broadcast<Staging> staging;
  private final int failOncePartition;

  /**
   * @param staging where the files live when they are copied to and from the executor ({@link
   *     StagedFile}), broadcast, or null when every node mounts them at the same path
   */
  PartitionWork(Broadcast<RunSpec> spec, Broadcast<Staging> staging, int failOncePartition) {
    this.spec = spec;
    this.staging = staging;
    this.failOncePartition = failOncePartition;
  }

  @Override
  public Iterator<IndexedOutcome> call(Iterator<IndexedFile> files) throws IOException {
    TaskContext tc = TaskContext.get();
    FileTask task = FileTask.open(spec.value(), ExecutorBudget.get(), tc::isInterrupted);
    if (tc.attemptNumber() > 0) {
      task = task.overwriting();
    }
    boolean injectFailure = tc.partitionId() == failOncePartition && tc.attemptNumber() == 0;
    Staging where = staging == null ? null : staging.value();
    Path model = null;
    try {
      StagedFile staged = null;
      if (where != null) {
        model = Files.createTempFile(Scratch.folder(), "cleave-model-", ".json");
        Files.write(model, spec.value().modelJson());
        staged = new StagedFile(where, model);
      }
      List<IndexedOutcome> out = new ArrayList<>();
      while (files.hasNext()) {
        IndexedFile f = files.next();
        FileOutcome o = staged == null ? task.run(f.relative()) : staged.run(task, f.relative());
        out.add(new IndexedOutcome(f.index(), o));
        if (injectFailure) {
          throw new IllegalStateException(
              "failure injected for testing after " + f.relative() + " (first attempt only)");
        }
      }
      return out.iterator();
    } finally {
      if (model != null) {
        Files.deleteIfExists(model);
      }
    }
  }
}
