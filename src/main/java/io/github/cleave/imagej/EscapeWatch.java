package io.github.cleave.imagej;

import ij.IJ;

/**
 * Watches ImageJ's Esc key while a long operation runs and calls {@code onEscape} once when it is
 * pressed (ImageJ records the key in {@link IJ#escapePressed()}). Polls every 100 ms on a daemon
 * thread; {@link #close()} stops watching. Resets the key state when it starts.
 */
final class EscapeWatch implements AutoCloseable {
  private final Thread thread;
  private volatile boolean closed;

  EscapeWatch(Runnable onEscape) {
    IJ.resetEscape();
    thread =
        new Thread(
            () -> {
              while (!closed) {
                if (IJ.escapePressed()) {
                  onEscape.run();
                  return;
                }
                try {
                  Thread.sleep(100);
                } catch (InterruptedException e) {
                  return;
                }
              }
            },
            "Cleave Esc watch");
    thread.setDaemon(true);
    thread.start();
  }

  /** Interrupts {@code worker} on Esc. */
  static EscapeWatch interrupting(Thread worker) {
    return new EscapeWatch(worker::interrupt);
  }

  @Override
  public void close() {
    closed = true;
    thread.interrupt();
  }
}
