package io.github.cleave.imagej;

import ij.IJ;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.TimeUnit;

/**
 * ImageJ's progress bar and status bar for work whose length is not known in advance, split into
 * phases that the plugin controls (the pipeline itself reports no progress). Each phase owns a band
 * {@code [from, to)} of the bar; while it runs the bar moves through the band as {@code from + (to
 * − from) · (1 − e^(−t/T))}, with {@code t} the time in the phase and {@code T} its expected length
 * (from the voxel count), so it keeps moving on slow machines and never reaches the band's end
 * before the phase does (common practice for work of unknown length, no source).
 *
 * <p>Work shorter than {@value #DELAY_MS} ms shows nothing, so that quick cuts do not flash the
 * bar; once shown, {@link #close()} clears the bar. The bar is updated every {@value #TICK_MS} ms
 * by one shared daemon thread. Thread-safe.
 */
final class WorkProgress implements AutoCloseable {
  /** Work shorter than this shows no progress, in milliseconds. */
  static final long DELAY_MS = 300;

  /** The update interval, in milliseconds. */
  static final long TICK_MS = 150;

  /** Expected milliseconds per million voxels of a phase (a few times the measured medians). */
  static final double MS_PER_MEGAVOXEL = 1000;

  private static final double MAX_SHOWN = 0.99;

  /** Where progress goes. */
  interface Sink {
    /** The bar: a fraction in [0, 1); 1 clears it. */
    void progress(double fraction);

    /** The status bar. */
    void status(String line);
  }

  /** ImageJ's progress bar and status bar. */
  static final Sink IMAGEJ =
      new Sink() {
        @Override
        public void progress(double fraction) {
          IJ.showProgress(fraction);
        }

        @Override
        public void status(String line) {
          IJ.showStatus("Cleave: " + line);
        }
      };

  private static final ScheduledExecutorService TICKER =
      Executors.newSingleThreadScheduledExecutor(
          r -> {
            Thread t = new Thread(r, "Cleave progress");
            t.setDaemon(true);
            return t;
          });

  private final Sink sink;
  private final long start;
  private ScheduledFuture<?> ticking;
  private String text = "";
  private double from;
  private double to;
  private double expectedMs = 1;
  private long phaseStart;
  private double shown = -1; // the last fraction shown, or -1 if nothing was shown
  private boolean closed;

  /**
   * Progress into {@code sink}, starting now at {@code nowNanos}; nothing ticks by itself (call
   * {@link #tick}).
   */
  WorkProgress(Sink sink, long nowNanos) {
    this.sink = sink;
    this.start = nowNanos;
    this.phaseStart = nowNanos;
  }

  /** Progress on ImageJ's bar, ticking by itself until closed. */
  static WorkProgress start() {
    WorkProgress p = new WorkProgress(IMAGEJ, System.nanoTime());
    ScheduledFuture<?> f =
        TICKER.scheduleWithFixedDelay(
            () -> p.tick(System.nanoTime()), TICK_MS, TICK_MS, TimeUnit.MILLISECONDS);
    synchronized (p) {
      p.ticking = f;
    }
    return p;
  }

  /**
   * Starts a phase now.
   *
   * @param line what is done, for the status bar
   * @param from where the phase's band of the bar begins, in [0, 1)
   * @param to where it ends, in (from, 1]
   * @param voxels the voxels the phase works on (its expected length follows from them)
   */
  void phase(String line, double from, double to, long voxels) {
    phase(line, from, to, voxels, System.nanoTime());
  }

  /** {@link #phase(String, double, double, long)} at a given time (for tests). */
  synchronized void phase(String line, double from, double to, long voxels, long nowNanos) {
    if (!(from >= 0 && from < to && to <= 1)) {
      throw new IllegalArgumentException(
          "progress band [" + from + ", " + to + ") must lie within [0, 1] and not be empty");
    }
    this.text = line;
    this.from = Math.max(from, shown); // the bar never moves back
    this.to = Math.max(to, this.from);
    this.expectedMs = Math.max(50, voxels / 1e6 * MS_PER_MEGAVOXEL);
    this.phaseStart = nowNanos;
    if (shown >= 0) {
      show(nowNanos);
    }
  }

  /** Updates the bar for the time {@code nowNanos}. */
  synchronized void tick(long nowNanos) {
    if (closed || (nowNanos - start) / 1e6 < DELAY_MS) {
      return;
    }
    show(nowNanos);
  }

  private void show(long nowNanos) {
    double f = fraction(from, to, (nowNanos - phaseStart) / 1e6, expectedMs);
    shown = Math.min(MAX_SHOWN, Math.max(shown, f)); // 1 would clear the bar
    sink.status(text);
    sink.progress(shown);
  }

  /** The bar's position {@code elapsedMs} into a phase of band [from, to) expected to last T. */
  static double fraction(double from, double to, double elapsedMs, double expectedMs) {
    double t = Math.max(0, elapsedMs) / expectedMs;
    return from + (to - from) * -Math.expm1(-t);
  }

  /** Whether the bar was shown. */
  synchronized boolean wasShown() {
    return shown >= 0;
  }

  /** Stops ticking and clears the bar if it was shown. */
  @Override
  public synchronized void close() {
    if (closed) {
      return;
    }
    closed = true;
    if (ticking != null) {
      ticking.cancel(false);
    }
    if (shown >= 0) {
      sink.progress(1.0);
    }
  }
}
