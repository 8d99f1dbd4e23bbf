package io.github.cleave.io;

import java.io.BufferedOutputStream;
import java.io.FilterOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ThreadLocalRandom;

/**
 * Writes files so that no partial file is ever visible under the final name: the content goes to a
 * hidden temporary sibling ({@code .NAME.RANDOM.part}), which is renamed into place only after it
 * was written and closed completely. On failure the temporary file is deleted; when the JVM is
 * stopped while a file is being written (Ctrl-C, SIGTERM), a shutdown hook deletes the temporary
 * files still open, so no partial file remains under any name. (A SIGKILL cannot be intercepted:
 * then a hidden {@code .part} file may remain, never a partial file under the final name.)
 *
 * <p>Thread-safe.
 */
public final class AtomicFiles {
  private static final Set<Path> IN_PROGRESS = ConcurrentHashMap.newKeySet();

  static {
    Runtime.getRuntime()
        .addShutdownHook(
            new Thread(
                () -> {
                  for (Path p : IN_PROGRESS) {
                    try {
                      Files.deleteIfExists(p);
                    } catch (IOException e) {
                      // best effort while the JVM stops
                    }
                  }
                },
                "cleave-remove-partial-files"));
  }

  private AtomicFiles() {}

  /** Writes the content of a file to a stream. */
  @FunctionalInterface
  public interface Content {
    /** Writes everything to {@code out}; the caller closes it. */
    void writeTo(OutputStream out) throws IOException;
  }

  /**
   * Writes {@code target} atomically, replacing an existing file of that name.
   *
   * @throws IOException if writing or renaming fails; then nothing is left behind
   */
  public static void write(Path target, Content content) throws IOException {
    Path absolute = target.toAbsolutePath();
    Path temporary =
        absolute.resolveSibling(
            "."
                + absolute.getFileName()
                + "."
                + Long.toHexString(ThreadLocalRandom.current().nextLong())
                + ".part");
    IN_PROGRESS.add(temporary);
    try {
      try (FileChannel channel =
          FileChannel.open(temporary, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE)) {
        OutputStream buffered =
            new BufferedOutputStream(Channels.newOutputStream(channel), 1 << 16);
        content.writeTo(new KeepOpen(buffered)); // a content that closes its stream keeps ours open
        buffered.flush();
        channel.force(true); // on disk before the rename makes it visible
      }
      try {
        Files.move(
            temporary,
            absolute,
            StandardCopyOption.ATOMIC_MOVE,
            StandardCopyOption.REPLACE_EXISTING);
      } catch (AtomicMoveNotSupportedException e) {
        Files.move(temporary, absolute, StandardCopyOption.REPLACE_EXISTING);
      }
    } finally {
      try {
        Files.deleteIfExists(temporary); // only still there if something failed
      } catch (IOException e) {
        // best effort: do not hide the failure that brought us here
      }
      IN_PROGRESS.remove(temporary);
    }
  }

  /** Passes writes through; {@code close()} only flushes, so the file can still be forced. */
  private static final class KeepOpen extends FilterOutputStream {
    KeepOpen(OutputStream out) {
      super(out);
    }

    @Override
    public void write(byte[] b, int off, int len) throws IOException {
      out.write(b, off, len);
    }

    @Override
    public void close() throws IOException {
      flush();
    }
  }
}
