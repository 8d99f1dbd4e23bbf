package io.github.cleave.spark;

import io.github.cleave.batch.PreparedRun;
import java.io.FileNotFoundException;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.concurrent.ThreadLocalRandom;
import java.util.stream.Stream;
import org.apache.hadoop.conf.Configuration;
import org.apache.hadoop.fs.ChecksumFileSystem;
import org.apache.hadoop.fs.FileSystem;
import org.apache.hadoop.fs.LocatedFileStatus;
import org.apache.hadoop.fs.Path;
import org.apache.hadoop.fs.RemoteIterator;

/**
 * Copies between the local disk and a Hadoop {@link FileSystem}, the way a folder run writes:
 * downloads replace the local file; uploads go to a hidden temporary file {@code .NAME.HEX.part}
 * beside the target (created with {@code overwrite=false}), then are renamed onto it, the temporary
 * file deleted on any failure. The rename is atomic where the file system's is (HDFS, the local
 * disk); on object stores (S3) a rename is a copy, so a killed job may leave {@code .part} objects,
 * which {@link #removeParts} deletes at the next run. Replacing an existing target deletes it first
 * when the file system's rename does not overwrite (HDFS): a reader may then briefly miss the file,
 * never see half of it. Stateless, thread-safe.
 */
final class RemoteFiles {
  private RemoteFiles() {}

  /**
   * The file system of {@code path}; for the local one ({@code file:}) without Hadoop's {@code
   * .NAME.crc} side files, so that the outputs are the same files as a plain run's.
   */
  static FileSystem fileSystem(Path path, Configuration conf) throws IOException {
    FileSystem fs = path.getFileSystem(conf);
    return fs instanceof ChecksumFileSystem c ? c.getRawFileSystem() : fs;
  }

  /**
   * The {@code file:} path of a local path: absolute, normalised, without a trailing {@code /} (a
   * {@link java.net.URI} of a folder has one, which would make it differ from the same folder as
   * listed).
   */
  static Path fileUrl(java.nio.file.Path local) {
    return new Path("file", null, local.toAbsolutePath().normalize().toString());
  }

  /** Copies {@code remote} to {@code local}, replacing it; creates the local parent folders. */
  static void download(FileSystem fs, Path remote, java.nio.file.Path local) throws IOException {
    Files.createDirectories(local.toAbsolutePath().getParent());
    try (InputStream in = fs.open(remote)) {
      Files.copy(in, local, StandardCopyOption.REPLACE_EXISTING);
    }
  }

  /** {@link #download} if {@code remote} is a file; returns whether it was. */
  static boolean downloadIfFile(FileSystem fs, Path remote, java.nio.file.Path local)
      throws IOException {
    try {
      if (!fs.getFileStatus(remote).isFile()) {
        return false;
      }
    } catch (FileNotFoundException e) {
      return false;
    }
    download(fs, remote, local);
    return true;
  }

  /** Copies {@code local} to {@code remote} through a temporary file and a rename. */
  static void upload(FileSystem fs, java.nio.file.Path local, Path remote) throws IOException {
    String hex = Long.toHexString(ThreadLocalRandom.current().nextLong() >>> 4);
    Path tmp = new Path(remote.getParent(), "." + remote.getName() + "." + hex + ".part");
    boolean done = false;
    try {
      try (OutputStream out = fs.create(tmp, false)) {
        Files.copy(local, out);
      }
      if (!fs.rename(tmp, remote)) {
        fs.delete(remote, false);
        if (!fs.rename(tmp, remote)) {
          throw new IOException("cannot rename " + tmp + " to " + remote);
        }
      }
      done = true;
    } finally {
      if (!done) {
        try {
          fs.delete(tmp, false);
        } catch (IOException suppressed) {
          // the next run removes it
        }
      }
    }
  }

  /**
   * Deletes the hidden temporary files ({@link PreparedRun#isTemporaryName}) in {@code out} and
   * below; call only when no task of this run is writing.
   *
   * @return how many were deleted
   */
  static int removeParts(FileSystem fs, Path out) throws IOException {
    if (!fs.exists(out)) {
      return 0;
    }
    List<Path> parts = new ArrayList<>();
    RemoteIterator<LocatedFileStatus> it = fs.listFiles(out, true);
    while (it.hasNext()) {
      Path p = it.next().getPath();
      if (PreparedRun.isTemporaryName(p.getName())) {
        parts.add(p);
      }
    }
    for (Path p : parts) {
      fs.delete(p, false);
    }
    return parts.size();
  }

  /** Deletes a local folder and everything in it, as far as it can (a scratch folder). */
  static void deleteLocalTree(java.nio.file.Path dir) {
    try (Stream<java.nio.file.Path> s = Files.walk(dir)) {
      s.sorted(Comparator.reverseOrder())
          .forEach(
              p -> {
                try {
                  Files.deleteIfExists(p);
                } catch (IOException e) {
                  // a scratch folder; the system's cleaning takes what is left
                }
              });
    } catch (IOException e) {
      // as above
    }
  }
}
