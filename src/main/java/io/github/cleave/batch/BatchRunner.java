package io.github.cleave.batch;

import io.github.cleave.image.BadInputException;
import java.awt.image.BufferedImage;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.concurrent.CancellationException;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Applies a saved model to every matching file of a folder: the folder runner behind the {@code
 * batch} command, usable by any front door (no console, no exit).
 *
 * <p><b>Order of work.</b> The driver-side phases are {@link PreparedRun}'s, the per-file work
 * {@link FileTask}'s, shared with distributed runs. Read the model; find the files ({@link
 * InputScan}: sorted by relative path, clashes and folder mistakes refused up front with a {@link
 * BadInputException}); lock the output folder; refuse a folder whose {@code run.started.json} names
 * another model unless {@code overwrite}; delete hidden temporary files left by a killed run and an
 * old {@code run.json}; fix one display range per channel for the run's pictures (kept from {@code
 * run.started.json} when resuming, else from the first file, in run order, that reads and has the
 * model's channel count) and write {@code run.started.json}; then segment the files on {@code
 * threads} workers, each reading one image at a time within a shared heap budget ({@link
 * MemoryBudget}); then write {@code objects.csv}, {@code files.csv}, {@code contact-sheet.png} and,
 * last, {@code run.json}.
 *
 * <p><b>Isolation and resume.</b> A file that cannot be segmented fails alone ({@link FileJob}). A
 * file whose outputs are complete from an earlier run with the same model, image and seeds is kept,
 * not recomputed ({@link ResumeCheck}), unless {@code overwrite}; failed files are tried again.
 * Every file is written atomically, so a run stopped at any point leaves only complete files, and a
 * rerun finishes the work.
 *
 * <p><b>Reproducibility.</b> Each image is segmented single-threaded by the same pipeline as a
 * single-image {@code apply}; results are collected in run order, so masks, label images and every
 * CSV except the time column are the same bytes whatever the thread count.
 *
 * <p>One run per instance. {@link #run} may be cancelled from another thread by {@link #cancel} or
 * by interrupting the thread that called it; then it throws {@link CancellationException}, no new
 * file is started and no folder output is written.
 */
public final class BatchRunner {
  private final BatchSettings settings;
  private final BatchListener listener;
  private final CountDownLatch stopped = new CountDownLatch(1);
  private volatile boolean cancelled;
  private volatile ExecutorService workers;

  /** A runner for {@code settings} that reports to {@code listener}. */
  public BatchRunner(BatchSettings settings, BatchListener listener) {
    this.settings = settings;
    this.listener = listener == null ? BatchListener.NONE : listener;
  }

  /**
   * Runs the batch.
   *
   * @return every file's outcome; failed files are in it, not thrown
   * @throws BadInputException for a problem found before any image is segmented (model, folders,
   *     pattern, no file, name clashes, a folder of another model's run)
   * @throws IOException if a folder output cannot be written
   * @throws CancellationException if cancelled
   */
  public BatchResult run() throws IOException {
    try {
      return runLocked();
    } finally {
      stopped.countDown();
    }
  }

  /** Stops the run: no new file starts, files being segmented are interrupted. */
  public void cancel() {
    cancelled = true;
    ExecutorService w = workers;
    if (w != null) {
      w.shutdownNow();
    }
  }

  /** {@link #cancel}, then waits up to {@code millis} for {@link #run} to return. */
  public boolean cancelAndWait(long millis) throws InterruptedException {
    cancel();
    return stopped.await(millis, TimeUnit.MILLISECONDS);
  }

  private BatchResult runLocked() throws IOException {
    try (PreparedRun run = PreparedRun.prepare(settings)) {
      FileTask task = run.task(MemoryBudget.of(settings.heapBudgetBytes()), () -> cancelled);
      FileJob.Done[] done = segmentAll(task, run.inputs());
      List<FileOutcome> outcomes = new ArrayList<>();
      List<BufferedImage> thumbnails = new ArrayList<>();
      for (FileJob.Done d : done) {
        outcomes.add(d.outcome());
        thumbnails.add(d.thumbnail());
      }
      return run.finish(outcomes, thumbnails, settings.threads());
    }
  }

  private FileJob.Done[] segmentAll(FileTask task, List<InputScan.InputFile> files)
      throws IOException {
    int n = files.size();
    FileJob.Done[] done = new FileJob.Done[n];
    AtomicInteger next = new AtomicInteger();
    int[] counts = new int[3]; // finished, failed, kept; guarded by counts
    long start = System.nanoTime();
    int threads = Math.min(settings.threads(), n);
    ExecutorService pool =
        Executors.newFixedThreadPool(
            threads,
            r -> {
              Thread t = new Thread(r, "cleave-batch-worker");
              t.setDaemon(true);
              return t;
            });
    workers = pool;
    if (cancelled) {
      pool.shutdownNow();
    }
    List<Future<?>> futures = new ArrayList<>();
    try {
      for (int k = 0; k < threads; k++) {
        futures.add(
            pool.submit(
                () -> {
                  for (int i; !cancelled && (i = next.getAndIncrement()) < n; ) {
                    FileJob.Done d = task.run(files.get(i), i < FolderOutputs.SHEET_FILES);
                    done[i] = d;
                    synchronized (counts) {
                      counts[0]++;
                      counts[1] += d.outcome().failed() ? 1 : 0;
                      counts[2] += d.outcome().reused() ? 1 : 0;
                      listener.progress(
                          new BatchProgress(
                              counts[0], counts[1], counts[2], n, System.nanoTime() - start));
                    }
                  }
                  return null;
                }));
      }
      for (Future<?> f : futures) {
        f.get();
      }
    } catch (InterruptedException e) {
      cancel();
      awaitWorkers(pool);
      Thread.currentThread().interrupt();
      throw new CancellationException("interrupted");
    } catch (ExecutionException e) {
      cancel();
      awaitWorkers(pool);
      Throwable cause = e.getCause();
      if (cause instanceof CancellationException c) {
        throw c;
      }
      if (cause instanceof UncheckedIOException u) {
        throw u.getCause();
      }
      if (cause instanceof RuntimeException r) {
        throw r;
      }
      if (cause instanceof Error err) {
        throw err;
      }
      throw new IllegalStateException(cause);
    } catch (CancellationException e) {
      cancel();
      awaitWorkers(pool);
      throw e;
    } finally {
      pool.shutdownNow();
    }
    if (cancelled || Arrays.asList(done).contains(null)) {
      throw new CancellationException("interrupted");
    }
    return done;
  }

  private static void awaitWorkers(ExecutorService pool) {
    try {
      pool.awaitTermination(30, TimeUnit.SECONDS);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
  }
}
