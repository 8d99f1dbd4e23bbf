package io.github.cleave.spark;

import io.github.cleave.batch.BatchResult;
import io.github.cleave.batch.BatchSettings;
import io.github.cleave.batch.FileOutcome;
import io.github.cleave.batch.PreparedRun;
import io.github.cleave.cli.BatchOptions;
import io.github.cleave.cli.BatchReport;
import io.github.cleave.cli.CleaveCommand;
import io.github.cleave.image.BadInputException;
import java.io.PrintWriter;
import java.util.List;
import java.util.concurrent.Callable;
import org.apache.spark.SparkConf;
import org.apache.spark.SparkException;
import org.apache.spark.api.java.JavaSparkContext;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * The folder run of {@code cleave batch} on Apache Spark: the same options (less {@code
 * --threads}), the same per-file function and the same outputs, byte for byte except the time
 * column of {@code files.csv}, records' timings and the times in {@code run.json}.
 *
 * <p>On the driver: {@link PreparedRun#prepare} (model, scan, lock, refusals, leftovers, display
 * ranges, {@code run.started.json}), then {@link ClusterRun} (the model's bytes broadcast once,
 * partitions of {@code --files-per-partition} files, per-file failures caught inside the tasks),
 * then {@link PreparedRun#finish} ({@code objects.csv}, {@code files.csv}, {@code
 * contact-sheet.png}, {@code run.json}). Plain paths must be on a file system mounted at the same
 * path on every node; URLs ({@code hdfs://}, {@code s3a://}, {@code file:}) are reached through
 * Hadoop's file system client, each file copied to the executor and its outputs back ({@link
 * JobPaths}, {@link StagedRun}).
 *
 * <p>Exit codes as {@code batch}: 0 every file segmented, 2 bad arguments or unusable input
 * (nothing segmented), 3 some files failed; and 4 when Spark gave up on the job (a task failed
 * {@code spark.task.maxFailures} times): complete outputs stay and a rerun resumes.
 */
@Command(
    name = "cleave-spark-batch",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Applies a model saved by 'cleave learn' to every matching image of a folder on an Apache"
          + " Spark cluster (or embedded, with --master local[*]), writing exactly what 'cleave"
          + " batch' writes.",
      "Paths are plain paths on a file system mounted at the same path on every node (NFS,"
          + " Lustre, GPFS; on a cluster, absolute), or URLs of any file system Hadoop's client"
          + " reaches (hdfs://, s3a://, file:), whose files are copied to the executors and back."
          + " Run it with spark-submit, or with java -cp and the JVM flags Spark needs on Java 17"
          + " (see the README).",
      "Exit codes: 0 every file segmented; 2 bad arguments or unusable folder, model or pattern;"
          + " 3 some files failed (see files.csv); 4 Spark gave up on the job (a rerun resumes)."
    })
public final class SparkBatchJob implements Callable<Integer> {
  /** Exit code when Spark aborted the job. */
  static final int JOB_FAILED = 4;

  /** Test hook: the partition whose first attempt fails after its first file (-1: none). */
  static final String FAIL_ONCE_PROPERTY = "cleave.spark.failOncePartition";

  /** Default files per partition: a few, so that slow files spread and retries are cheap. */
  static final int DEFAULT_FILES_PER_PARTITION = 4;

  @Mixin BatchOptions batch;

  @Option(
      names = "--master",
      paramLabel = "URL",
      description =
          "Spark master when run embedded, e.g. local[*] or local[2]; default: the one"
              + " spark-submit gives.")
  String master;

  @Option(
      names = "--files-per-partition",
      paramLabel = "N",
      defaultValue = "" + DEFAULT_FILES_PER_PARTITION,
      description = "Files per Spark task (default ${DEFAULT-VALUE}).")
  int filesPerPartition;

  @Spec CommandSpec spec;

  private final JavaSparkContext shared;

  /** A job that starts (and stops) its own Spark context. */
  public SparkBatchJob() {
    this(null);
  }

  private SparkBatchJob(JavaSparkContext shared) {
    this.shared = shared;
  }

  /** Runs the job from the command line and exits with its exit code. */
  public static void main(String[] args) {
    if (System.getProperty("log4j2.configurationFile") == null) {
      System.setProperty("log4j2.configurationFile", "cleave-spark-log4j2.properties");
    }
    System.exit(commandLine(null).execute(args));
  }

  /**
   * The job's command line with the error handling of {@code cleave}; with {@code shared} non-null
   * the job runs on that context (and leaves it running) instead of starting its own.
   */
  public static CommandLine commandLine(JavaSparkContext shared) {
    return CleaveCommand.withErrorHandling(new CommandLine(new SparkBatchJob(shared)));
  }

  @Override
  public Integer call() throws Exception {
    if (filesPerPartition < 1) {
      throw new ParameterException(
          spec.commandLine(),
          "--files-per-partition " + filesPerPartition + ": give 1 or more (default 4)");
    }
    PrintWriter err = spec.commandLine().getErr();
    BatchSettings settings = batch.settings(1);
    SparkConf conf = shared == null ? conf() : null;
    String masterUrl = shared != null ? shared.master() : conf.get("spark.master");
    JobPaths paths = JobPaths.of(spec.commandLine().getParseResult());
    paths.checkAbsolute(masterUrl);
    int failOnce = Integer.getInteger(FAIL_ONCE_PROPERTY, -1);
    if (paths.staged()) {
      JavaSparkContext sc = shared != null ? shared : start(conf);
      try {
        if (shared == null) {
          sc.setLogLevel("WARN");
        }
        return StagedRun.run(
            sc, settings, paths, filesPerPartition, failOnce, spec.commandLine().getOut(), err);
      } finally {
        if (shared == null) {
          sc.stop();
        }
      }
    }
    try (PreparedRun run = PreparedRun.prepare(settings)) {
      int partitions = ClusterRun.partitions(run.files().size(), filesPerPartition);
      err.println(
          "cleave: segmenting "
              + run.files().size()
              + " file(s) of "
              + settings.in()
              + " with "
              + settings.model().getFileName()
              + " on "
              + masterUrl
              + " in "
              + partitions
              + " partition(s)");
      err.flush();
      JavaSparkContext sc = shared != null ? shared : start(conf);
      List<FileOutcome> outcomes;
      int workers;
      try {
        workers = Math.max(1, sc.defaultParallelism());
        if (shared == null) {
          sc.setLogLevel("WARN");
        }
        outcomes = distribute(sc, run, null, filesPerPartition, failOnce, err);
      } finally {
        if (shared == null) {
          sc.stop();
        }
      }
      if (outcomes == null) {
        return JOB_FAILED;
      }
      run.removeLeftoverParts();
      BatchResult result = run.finish(outcomes, workers);
      return BatchReport.print(result, settings.out(), spec.commandLine().getOut(), err);
    }
  }

  /**
   * The tasks of a prepared run ({@link ClusterRun#segment}); null, with a line on {@code err},
   * when Spark gave up on the job.
   */
  static List<FileOutcome> distribute(
      JavaSparkContext sc,
      PreparedRun run,
      Staging staging,
      int filesPerPartition,
      int failOncePartition,
      PrintWriter err) {
    try {
      return ClusterRun.segment(sc, run, staging, filesPerPartition, failOncePartition, err);
    } catch (Exception e) {
      if (!(e instanceof SparkException)) {
        throw e;
      }
      String why = String.valueOf(e.getMessage()).lines().findFirst().orElse("");
      err.println(
          "cleave: the Spark job failed: "
              + why
              + " (see the log above); complete outputs stay, a rerun resumes");
      err.flush();
      return null;
    }
  }

  /** The configuration of the job's own context: spark-submit's, or embedded with --master. */
  private SparkConf conf() {
    SparkConf conf = new SparkConf().setAppName("cleave batch");
    if (master != null) {
      conf.setMaster(master);
    }
    if (!conf.contains("spark.master")) {
      throw new BadInputException(
          "no Spark master: run the job with spark-submit, or give --master local[*] to run it"
              + " embedded");
    }
    if (conf.getBoolean("spark.speculation", false)) {
      throw new BadInputException(
          "spark.speculation is on: two attempts of one task would write the same files at once;"
              + " run the job with --conf spark.speculation=false");
    }
    if (conf.get("spark.master").startsWith("local")) {
      conf.setIfMissing("spark.ui.enabled", "false");
      conf.setIfMissing("spark.driver.host", "localhost");
      conf.setIfMissing("spark.driver.bindAddress", "127.0.0.1");
    }
    return conf;
  }

  /** Starts the job's own context, explaining the usual reason when it cannot. */
  private static JavaSparkContext start(SparkConf conf) {
    try {
      return new JavaSparkContext(conf);
    } catch (IllegalAccessError | ExceptionInInitializerError e) {
      throw new BadInputException(
          "Spark cannot start on this Java: it needs the --add-opens flags and"
              + " -Djdk.reflect.useDirectMethodHandle=false (spark-submit adds the first; see the"
              + " README, section On a Spark cluster, or the property spark.jvm.flags in pom.xml)"
              + " ("
              + e
              + ")");
    }
  }
}
