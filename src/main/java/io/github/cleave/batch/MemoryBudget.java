package io.github.cleave.batch;

import io.github.cleave.image.BadInputException;
import java.util.Locale;

/**
 * The heap a folder run lets its images use at once. Before reading an image, a worker reserves the
 * image's estimated need ({@code io.ImageFiles.estimateHeapBytes}); it waits while other workers
 * hold too much, and an image whose need exceeds the whole budget is refused at once with the
 * memory it needs, so that parallel workers never run the heap out together and a too-large file
 * fails alone. Thread-safe.
 *
 * <p>One budget per JVM that runs files: the local runner makes one per run, a distributed worker
 * one per worker JVM, shared by its task threads.
 */
public final class MemoryBudget {
  /** Share of the free heap at the start that images may use; the rest is for everything else. */
  static final double SHARE = 0.8;

  private final long total;
  private long reserved;

  MemoryBudget(long total) {
    if (total < 1) {
      throw new IllegalArgumentException("memory budget " + total + ": need at least 1 byte");
    }
    this.total = total;
  }

  /** {@code bytes} if positive, else {@link #SHARE} of the heap the JVM can still use. */
  public static MemoryBudget of(long bytes) {
    if (bytes > 0) {
      return new MemoryBudget(bytes);
    }
    Runtime rt = Runtime.getRuntime();
    long free = rt.maxMemory() - (rt.totalMemory() - rt.freeMemory());
    return new MemoryBudget(Math.max(1, (long) (free * SHARE)));
  }

  long total() {
    return total;
  }

  /**
   * Reserves {@code bytes} (nothing for 0 or less), waiting until they are free.
   *
   * @throws BadInputException if {@code bytes} exceed the whole budget
   * @throws InterruptedException if interrupted while waiting
   */
  synchronized long reserve(long bytes, String file) throws InterruptedException {
    if (bytes <= 0) {
      return 0;
    }
    if (bytes > total) {
      long suggestGiB = Math.max(1, (long) Math.ceil(bytes / SHARE / (1L << 30))) + 1;
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "%s is too large for the heap: reading and segmenting it needs about %d MiB, this"
                  + " run can give one image at most %d MiB; start Java with a larger heap, e.g."
                  + " -Xmx%dg, or crop or bin the image",
              file,
              bytes >> 20,
              total >> 20,
              suggestGiB));
    }
    while (reserved + bytes > total) {
      wait();
    }
    reserved += bytes;
    return bytes;
  }

  /** Gives back what {@link #reserve} returned. */
  synchronized void release(long bytes) {
    if (bytes > 0) {
      reserved -= bytes;
      notifyAll();
    }
  }
}
