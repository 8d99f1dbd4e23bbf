package io.github.cleave.spark;

import io.github.cleave.batch.FileOutcome;
import io.github.cleave.batch.PreparedRun;
import io.github.cleave.batch.RunSpec;
import java.io.PrintWriter;
import java.io.Serializable;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.apache.spark.api.java.JavaRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.broadcast.Broadcast;
import scala.reflect.ClassTag;
import scala.reflect.ClassTag$;
import scala.runtime.AbstractFunction1;
import scala.runtime.AbstractFunction2;
import scala.runtime.BoxedUnit;

/**
 * The distributed middle of a folder run, between {@link PreparedRun#prepare} and {@link
 * PreparedRun#finish} on the driver: broadcasts the run's values ({@link RunSpec}, with the model's
 * bytes, and for a staged run its {@link Staging} with the Hadoop configuration) once, spreads the
 * files in run order over partitions of {@code filesPerPartition}, runs {@link PartitionWork} on
 * each, and gathers the outcomes back into run order. Prints one line per finished partition on the
 * driver's standard error (files done and failed so far).
 */
final class ClusterRun {
  private ClusterRun() {}

  /** The number of partitions for {@code files} files, {@code perPartition} to a partition. */
  static int partitions(int files, int perPartition) {
    return Math.max(1, (files + perPartition - 1) / perPartition);
  }

  /**
   * Segments the files of {@code run} on the cluster of {@code sc}.
   *
   * @param staging where the files live when tasks copy them ({@link StagedFile}); null for paths
   *     mounted on every node
   * @param failOncePartition test hook of {@link PartitionWork}; -1 for none
   * @return one outcome per file, in run order
   */
  static List<FileOutcome> segment(
      JavaSparkContext sc,
      PreparedRun run,
      Staging staging,
      int filesPerPartition,
      int failOncePartition,
      PrintWriter err) {
    List<String> names = run.files();
    List<IndexedFile> files = new ArrayList<>(names.size());
    for (int i = 0; i < names.size(); i++) {
      files.add(new IndexedFile(i, names.get(i)));
    }
    int partitions = partitions(files.size(), filesPerPartition);
    Broadcast<RunSpec> spec = sc.broadcast(run.spec());
    Broadcast<Staging> staged = staging == null ? null : sc.broadcast(staging);
    try {
      JavaRDD<IndexedOutcome> work =
          sc.parallelize(files, partitions)
              .mapPartitions(new PartitionWork(spec, staged, failOncePartition), true);
      FileOutcome[] outcomes = new FileOutcome[files.size()];
      Gather gather = new Gather(outcomes, partitions, err);
      ClassTag<ArrayList<IndexedOutcome>> tag = ClassTag$.MODULE$.apply(ArrayList.class);
      sc.sc().runJob(work.rdd(), new Drain(), gather, tag);
      for (int i = 0; i < outcomes.length; i++) {
        if (outcomes[i] == null) {
          throw new IllegalStateException("no outcome for " + names.get(i) + " came back");
        }
      }
      return Arrays.asList(outcomes);
    } finally {
      spec.destroy();
      if (staged != null) {
        staged.destroy();
      }
    }
  }

  /** In a task: the partition's outcomes as one list, sent to the driver. */
  private static final class Drain
      extends AbstractFunction1<
          scala.collection.Iterator<IndexedOutcome>, ArrayList<IndexedOutcome>>
      implements Serializable {
    private static final long serialVersionUID = 1L;

    @Override
    public ArrayList<IndexedOutcome> apply(scala.collection.Iterator<IndexedOutcome> it) {
      ArrayList<IndexedOutcome> list = new ArrayList<>();
      while (it.hasNext()) {
        list.add(it.next());
      }
      return list;
    }
  }

  /** On the driver, once per finished partition: files into place, one progress line. */
  private static final class Gather
      extends AbstractFunction2<Object, ArrayList<IndexedOutcome>, BoxedUnit> {
    private final FileOutcome[] outcomes;
    private final PrintWriter err;
    private final int partitions;
    private int partitionsDone;
    private int done;
    private int failed;

    Gather(FileOutcome[] outcomes, int partitions, PrintWriter err) {
      this.outcomes = outcomes;
      this.partitions = partitions;
      this.err = err;
    }

    @Override
    public synchronized BoxedUnit apply(Object partition, ArrayList<IndexedOutcome> rows) {
      for (IndexedOutcome r : rows) {
        outcomes[r.index()] = r.outcome();
        done++;
        failed += r.outcome().failed() ? 1 : 0;
      }
      partitionsDone++;
      err.println(
          String.format(
              Locale.ROOT,
              "cleave: spark: %d/%d files (%d failed), %d/%d partitions",
              done,
              outcomes.length,
              failed,
              partitionsDone,
              partitions));
      err.flush();
      return BoxedUnit.UNIT;
    }
  }
}
