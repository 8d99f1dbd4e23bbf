package io.github.cleave.spark;

import io.github.cleave.batch.FileOutcome;
import io.github.cleave.batch.FileTask;
import io.github.cleave.batch.InputNames;
import io.github.cleave.batch.PreparedRun;
import io.github.cleave.io.SeedFiles;
import java.io.IOException;
import java.io.InterruptedIOException;
import java.nio.file.Files;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.stream.Stream;
import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.Path;

/**
 * One file of a staged run, on an executor: copies the input (and its {@code NAME.seeds.*} files
 * beside it and in the seeds folder) into a fresh local folder laid out as the run's; when resuming
 * and the file's record exists remotely, copies its earlier outputs too; runs the run's {@link
 * FileTask} on the local folders; copies the outputs it wrote back ({@link RemoteFiles#upload}, the
 * record last, its paths naming the remote files), or, for a failed file, deletes its remote
 * record; and deletes the local folder, whatever happened. Any failure, copies included, becomes
 * the file's failed outcome; only cancellation propagates. Local space: one input and its outputs
 * per running task.
 */
final class StagedFile {
  private final Staging staging;
  private final Configuration conf;
  private final java.nio.file.Path model;

  /**
   * @param model a local file holding the run's model bytes
   */
  StagedFile(Staging staging, java.nio.file.Path model) {
    this.staging = staging;
    this.conf = staging.conf().get();
    this.model = model;
  }

  /**
   * Processes one file; complete outputs of an earlier run are kept unless {@code task} {@link
   * FileTask#overwrites() overwrites} (as it does when asked to and in a retried attempt).
   */
  FileOutcome run(FileTask task, String relative) {
    long start = System.nanoTime();
    java.nio.file.Path local = null;
    try {
      local = Files.createTempDirectory(Scratch.folder(), "cleave-stage-");
      java.nio.file.Path in = local.resolve("in");
      java.nio.file.Path out = local.resolve("out");
      java.nio.file.Path seeds = staging.seeds() == null ? null : local.resolve("seeds");
      Files.createDirectories(out);
      if (seeds != null) {
        Files.createDirectories(seeds);
      }
      String folder = InputNames.folderOf(relative);
      String base = InputNames.baseOf(relative);
      Path remoteIn = staging.inPath();
      FileSystem inFs = RemoteFiles.fileSystem(remoteIn, conf);
      RemoteFiles.download(inFs, Staging.below(remoteIn, relative), in.resolve(relative));
      Path remoteSeeds = seeds == null ? null : staging.seedsPath();
      FileSystem seedsFs = seeds == null ? null : RemoteFiles.fileSystem(remoteSeeds, conf);
      for (String suffix : SeedFiles.SUFFIXES) {
        String seedFile = InputNames.sibling(relative, suffix);
        RemoteFiles.downloadIfFile(inFs, Staging.below(remoteIn, seedFile), in.resolve(seedFile));
        if (seeds != null) {
          RemoteFiles.downloadIfFile(
              seedsFs, Staging.below(remoteSeeds, seedFile), seeds.resolve(seedFile));
        }
      }
      Path remoteOut = staging.outPath();
      FileSystem outFs = RemoteFiles.fileSystem(remoteOut, conf);
      Path outDir = Staging.below(remoteOut, folder);
      String record = base + ".record.json";
      if (!task.overwrites() && outFs.exists(new Path(outDir, record))) {
        for (String suffix : PreparedRun.outputSuffixes()) {
          RemoteFiles.downloadIfFile(
              outFs,
              new Path(outDir, base + suffix),
              out.resolve(InputNames.sibling(relative, suffix)));
        }
      }
      FileOutcome o = task.at(model, in, out, seeds).run(relative);
      if (o.reused()) {
        return o;
      }
      // as the local writer does: no old record may vouch for outputs being replaced, and a class
      // map of an earlier run with more classes must not stay beside the new outputs
      outFs.delete(new Path(outDir, record), false);
      if (!Files.exists(out.resolve(InputNames.sibling(relative, ".classes.tif")))) {
        outFs.delete(new Path(outDir, base + ".classes.tif"), false);
      }
      java.nio.file.Path localRecord = out.resolve(InputNames.sibling(relative, ".record.json"));
      for (java.nio.file.Path p : files(out)) {
        if (!p.equals(localRecord)) {
          RemoteFiles.upload(outFs, p, Staging.below(remoteOut, slashed(out.relativize(p))));
        }
      }
      if (!o.failed() && Files.isRegularFile(localRecord)) {
        java.nio.file.Path localIn = in;
        java.nio.file.Path localSeeds = seeds;
        JsonPaths.record(localRecord, p -> remote(p, localIn, localSeeds));
        RemoteFiles.upload(outFs, localRecord, new Path(outDir, record));
      }
      return withRemoteNames(o, in, seeds);
    } catch (CancellationException e) {
      throw e;
    } catch (IOException | RuntimeException e) {
      if (e instanceof InterruptedIOException || Thread.currentThread().isInterrupted()) {
        // a killed attempt (the job aborted, a duplicate attempt): not a fault of the file, and
        // the remote record, deleted only right before an upload, stays valid for a resume
        throw new CancellationException("interrupted while staging " + relative);
      }
      double ms = (System.nanoTime() - start) / 1e6;
      String why = String.valueOf(e.getMessage()).replace('\n', ' ').strip();
      if (local != null) {
        why = why.replace(local.toString(), "<executor's copy>");
      }
      String message =
          e instanceof IOException
              ? "cannot copy it between "
                  + staging.inPath()
                  + " / "
                  + staging.outPath()
                  + " and the executor's disk ("
                  + why
                  + "): check that the executors can read --in and --seeds and write --out, then"
                  + " run again to resume"
              : "unexpected error while staging it: " + e;
      return new FileOutcome(relative, FileOutcome.Status.FAILED, message, -1, ms, false);
    } finally {
      if (local != null) {
        RemoteFiles.deleteLocalTree(local);
      }
    }
  }

  /** The path the user would know for a local copy's path. */
  private String remote(String path, java.nio.file.Path in, java.nio.file.Path seeds) {
    java.nio.file.Path p = java.nio.file.Path.of(path);
    if (p.startsWith(in)) {
      return Staging.below(staging.inPath(), slashed(in.relativize(p))).toString();
    }
    if (seeds != null && p.startsWith(seeds)) {
      return Staging.below(staging.seedsPath(), slashed(seeds.relativize(p))).toString();
    }
    if (p.equals(model)) {
      return staging.model();
    }
    return path;
  }

  /** A failed file's message with the local folders named by their remote paths. */
  private FileOutcome withRemoteNames(
      FileOutcome o, java.nio.file.Path in, java.nio.file.Path seeds) {
    String m = o.message().replace(in.toString(), staging.in());
    if (seeds != null) {
      m = m.replace(seeds.toString(), staging.seeds());
    }
    return m.equals(o.message())
        ? o
        : new FileOutcome(o.file(), o.status(), m, o.objectCount(), o.timeMs(), o.reused());
  }

  private static List<java.nio.file.Path> files(java.nio.file.Path dir) throws IOException {
    List<java.nio.file.Path> all = new ArrayList<>();
    try (Stream<java.nio.file.Path> s = Files.walk(dir)) {
      s.filter(Files::isRegularFile)
          .filter(p -> !PreparedRun.isTemporaryName(p.getFileName().toString()))
          .sorted()
          .forEach(all::add);
    }
    return all;
  }

  private static String slashed(java.nio.file.Path relative) {
    return relative.toString().replace(relative.getFileSystem().getSeparator(), "/");
  }
}
