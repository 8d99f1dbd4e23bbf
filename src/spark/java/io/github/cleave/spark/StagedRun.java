package io.github.cleave.spark;

import io.github.cleave.batch.BatchResult;
import io.github.cleave.batch.BatchSettings;
import io.github.cleave.batch.FileOutcome;
import io.github.cleave.batch.InputNames;
import io.github.cleave.batch.PreparedRun;
import io.github.cleave.cli.BatchReport;
import io.github.cleave.image.BadInputException;
import java.io.FileNotFoundException;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.util.List;
import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.FSDataOutputStream;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.Path;
import org.apache.spark.api.java.JavaSparkContext;

/**
 * A folder run whose files are reached through Hadoop's {@link FileSystem} ({@link JobPaths}),
 * staged through local disks, on the driver. Before the tasks: checks the folders, lists the inputs
 * ({@link RemoteScan}), reads the model's bytes, takes the output folder's marker {@code
 * .cleave-job.lock} (created with {@code overwrite=false}, atomic on HDFS; refused if it exists),
 * removes leftover {@code .part} files and an old {@code run.json}, and prepares the run on a local
 * scratch mirror of the output folder ({@link PreparedRun#prepareListed}: the earlier {@code
 * run.started.json} copied in; the first usable input copied for the display ranges), uploading
 * {@code run.started.json}. The tasks copy each file in and its outputs out ({@link StagedFile}).
 * After them: leftover {@code .part} files removed; each segmented file's objects table and the
 * overlays shown on the contact sheet copied into the mirror; {@link PreparedRun#finish}; {@code
 * objects.csv}, {@code files.csv}, {@code contact-sheet.png} uploaded, then {@code run.json} last
 * (paths in the run files name the URLs, not the mirror); the marker removed; the mirror deleted.
 */
final class StagedRun {
  static final String LOCK = ".cleave-job.lock";

  private StagedRun() {}

  /** Runs the job; returns its exit code (as {@link SparkBatchJob}). */
  static int run(
      JavaSparkContext sc,
      BatchSettings s,
      JobPaths paths,
      int filesPerPartition,
      int failOncePartition,
      PrintWriter stdout,
      PrintWriter err)
      throws IOException {
    Configuration conf = sc.hadoopConfiguration();
    Path in = qualified("--in", paths.in(), conf);
    Path out = qualified("--out", paths.out(), conf);
    Path seeds = paths.seeds() == null ? null : qualified("--seeds", paths.seeds(), conf);
    FileSystem inFs = RemoteFiles.fileSystem(in, conf);
    FileSystem outFs = RemoteFiles.fileSystem(out, conf);
    checkFolders(inFs, in, outFs, out, seeds, conf, paths);
    InputNames names = InputNames.of(s.pattern());
    List<String> files = RemoteScan.list(inFs, in, out, names, s.recursive());
    names.check(files, paths.in(), s.recursive());
    java.nio.file.Path scratch = Files.createTempDirectory("cleave-driver-");
    try {
      String modelName = modelName(paths.model());
      java.nio.file.Path model = localModel(paths.model(), conf, scratch);
      java.nio.file.Path mirrorIn = scratch.resolve("in");
      java.nio.file.Path mirror = scratch.resolve("out");
      Files.createDirectories(mirrorIn);
      Files.createDirectories(mirror);
      outFs.mkdirs(out);
      Path lock = lock(outFs, out, paths.out());
      try {
        RemoteFiles.downloadIfFile(
            outFs, new Path(out, "run.started.json"), mirror.resolve("run.started.json"));
        BatchSettings local =
            new BatchSettings(
                model,
                mirrorIn,
                mirror,
                seeds == null ? null : scratch.resolve("seeds"),
                1,
                s.pattern(),
                s.recursive(),
                s.overwrite(),
                s.heapBudgetBytes(),
                s.timeAxis(),
                s.seedFrame(),
                s.seedsFromNeighbour());
        try (PreparedRun run =
            PreparedRun.prepareListed(local, files, rel -> fetch(inFs, in, rel, mirrorIn))) {
          // only now, with the folder's earlier run checked (another model's is refused above)
          RemoteFiles.removeParts(outFs, out);
          outFs.delete(new Path(out, "run.json"), false);
          JsonPaths.started(mirror.resolve("run.started.json"), modelName);
          RemoteFiles.upload(
              outFs, mirror.resolve("run.started.json"), new Path(out, "run.started.json"));
          int partitions = ClusterRun.partitions(files.size(), filesPerPartition);
          err.println(
              "cleave: segmenting "
                  + files.size()
                  + " file(s) of "
                  + paths.in()
                  + " with "
                  + model.getFileName()
                  + " on "
                  + sc.master()
                  + " in "
                  + partitions
                  + " partition(s), staged through Hadoop's file system client");
          err.flush();
          Staging staging =
              new Staging(
                  in.toString(),
                  out.toString(),
                  seeds == null ? null : seeds.toString(),
                  modelName,
                  new HadoopConf(conf));
          List<FileOutcome> outcomes =
              SparkBatchJob.distribute(sc, run, staging, filesPerPartition, failOncePartition, err);
          if (outcomes == null) {
            return SparkBatchJob.JOB_FAILED;
          }
          RemoteFiles.removeParts(outFs, out);
          fetchForFinish(outFs, out, files, outcomes, mirror);
          BatchResult result = run.finish(outcomes, Math.max(1, sc.defaultParallelism()));
          JsonPaths.run(
              mirror.resolve("run.json"), modelName, paths.in(), paths.out(), paths.seeds());
          for (String name : List.of("objects.csv", "files.csv", "contact-sheet.png", "run.json")) {
            if (Files.isRegularFile(mirror.resolve(name))) {
              RemoteFiles.upload(outFs, mirror.resolve(name), new Path(out, name));
            }
          }
          StringWriter report = new StringWriter();
          int exit;
          try (PrintWriter w = new PrintWriter(report)) {
            exit = BatchReport.print(result, mirror, w, err);
          }
          stdout.print(report.toString().replace(mirror.toString(), paths.out()));
          stdout.flush();
          return exit;
        }
      } finally {
        outFs.delete(lock, false);
      }
    } finally {
      RemoteFiles.deleteLocalTree(scratch);
    }
  }

  /** The qualified path of an option, or a one-line refusal when no file system serves it. */
  private static Path qualified(String option, String text, Configuration conf) {
    Path p = JobPaths.isUrl(text) ? new Path(text) : plain(text);
    try {
      return RemoteFiles.fileSystem(p, conf).makeQualified(p);
    } catch (IOException | RuntimeException e) {
      throw new BadInputException(
          option
              + " "
              + text
              + ": Hadoop's file system client cannot reach it ("
              + firstLine(e)
              + "); check the URL, or put the file system's client and settings on the class path");
    }
  }

  /** A plain path in a staged run: the same path on every node, as a {@code file:} URL. */
  private static Path plain(String text) {
    return RemoteFiles.fileUrl(java.nio.file.Path.of(text));
  }

  private static void checkFolders(
      FileSystem inFs,
      Path in,
      FileSystem outFs,
      Path out,
      Path seeds,
      Configuration conf,
      JobPaths paths)
      throws IOException {
    if (!isDirectory(inFs, in)) {
      throw new BadInputException(
          "the input folder "
              + paths.in()
              + " does not exist or is not a folder; give --in FOLDER");
    }
    if (outFs.exists(out) && !isDirectory(outFs, out)) {
      throw new BadInputException(
          "the output " + paths.out() + " is a file, not a folder: give a folder for the results");
    }
    if (out.equals(in)) {
      throw new BadInputException(
          "the output folder "
              + paths.out()
              + " is the input folder: choose another output folder so that inputs are never"
              + " overwritten");
    }
    if (seeds != null && !isDirectory(RemoteFiles.fileSystem(seeds, conf), seeds)) {
      throw new BadInputException(
          "the seeds folder " + paths.seeds() + " does not exist or is not a folder");
    }
  }

  private static boolean isDirectory(FileSystem fs, Path p) throws IOException {
    try {
      return fs.getFileStatus(p).isDirectory();
    } catch (FileNotFoundException e) {
      return false;
    }
  }

  /** The model as recorded: a URL as typed, a plain path as a path. */
  private static String modelName(String text) {
    return JobPaths.isUrl(text) ? text : java.nio.file.Path.of(text).toString();
  }

  /** The model's file on the driver's disk: a plain path itself, a URL's copy in the scratch. */
  private static java.nio.file.Path localModel(
      String text, Configuration conf, java.nio.file.Path scratch) throws IOException {
    if (!JobPaths.isUrl(text)) {
      return java.nio.file.Path.of(text);
    }
    Path remote = qualified("--model", text, conf);
    java.nio.file.Path copy = scratch.resolve("model").resolve(remote.getName());
    if (!RemoteFiles.downloadIfFile(RemoteFiles.fileSystem(remote, conf), remote, copy)) {
      throw new BadInputException(
          "the model file " + text + " does not exist or is not a file; give --model MODEL.json");
    }
    return copy;
  }

  /** Takes the output folder's marker, or refuses the folder if another job holds it. */
  private static Path lock(FileSystem fs, Path out, String text) throws IOException {
    Path lock = new Path(out, LOCK);
    try (FSDataOutputStream o = fs.create(lock, false)) {
      o.write("cleave job\n".getBytes(StandardCharsets.UTF_8));
    } catch (IOException e) {
      if (!fs.exists(lock)) {
        throw e;
      }
      throw new BadInputException(
          "another job is writing to the output folder "
              + text
              + " (it holds "
              + LOCK
              + "); wait for it to finish, or delete that file if no job is running");
    }
    return lock;
  }

  /** A local copy of an input, for the display ranges. */
  private static java.nio.file.Path fetch(
      FileSystem fs, Path in, String relative, java.nio.file.Path mirrorIn) {
    java.nio.file.Path local = mirrorIn.resolve(relative);
    try {
      RemoteFiles.download(fs, Staging.below(in, relative), local);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return local;
  }

  /**
   * Copies into the mirror what {@link PreparedRun#finish} reads: each segmented file's objects
   * table, and the overlays of the files the contact sheet shows.
   */
  private static void fetchForFinish(
      FileSystem fs,
      Path out,
      List<String> files,
      List<FileOutcome> outcomes,
      java.nio.file.Path mirror)
      throws IOException {
    for (int i = 0; i < files.size(); i++) {
      if (outcomes.get(i).failed()) {
        continue;
      }
      String relative = files.get(i);
      List<String> suffixes =
          i < PreparedRun.SHEET_FILES
              ? List.of(".objects.csv", ".overlay.png")
              : List.of(".objects.csv");
      for (String suffix : suffixes) {
        String name = InputNames.sibling(relative, suffix);
        if (suffix.equals(".overlay.png")) { // a missing picture leaves its tile out, as locally
          RemoteFiles.downloadIfFile(fs, new Path(out, name), mirror.resolve(name));
        } else {
          RemoteFiles.download(fs, new Path(out, name), mirror.resolve(name));
        }
      }
    }
  }

  private static String firstLine(Exception e) {
    return String.valueOf(e.getMessage()).lines().findFirst().orElse(e.toString());
  }
}
