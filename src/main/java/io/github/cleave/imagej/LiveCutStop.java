package io.github.cleave.imagej;

import ij.IJ;
import ij.ImagePlus;
import java.awt.Component;
import java.awt.Container;
import java.awt.event.KeyAdapter;
import java.awt.event.KeyEvent;
import java.awt.event.KeyListener;

/**
 * Esc for the seed brush's live cut, and newer requests superseding slow stale ones: stops the cut
 * running on the session's worker thread by interrupting it (the max-flow engine polls the
 * interrupt and returns early).
 *
 * <p>Esc is seen three ways: a key listener on the image window and canvas, the same listener on
 * the panel and its components ({@link #listenTo}), and ImageJ's own Esc flag ({@link
 * IJ#escapePressed()}, set when Esc is pressed on any ImageJ window), polled by {@link #poll()}
 * while a cut runs. The flag counts only if it went up after the cut began, so an old press never
 * stops a new cut; when it stops a cut it is reset. On the panel the listener also takes Ctrl+Z
 * (Cmd+Z) as Undo; on the image window ImageJ runs Edit &gt; Undo for it, which {@link BrushUndo}
 * routes to the strokes.
 *
 * <p>Thread-safe: {@link #begin}/{@link #end} run on the worker, {@link #stop} and {@link #poll} on
 * any thread. An Esc that arrives just as one cut ends and the next begins may stop the next one;
 * either way the session stays consistent.
 */
final class LiveCutStop {
  private final Runnable undo;
  private volatile long running; // the request being cut, 0 when the worker is idle
  private volatile Thread worker; // the thread of the running cut
  private volatile boolean escapeAtStart; // ImageJ's Esc flag was up when the cut began
  private volatile boolean slow; // the running cut is slow work (see #slow)
  final KeyListener keys = new Keys();

  /**
   * @param undo what Ctrl+Z on the panel does (runs on the event thread)
   */
  LiveCutStop(Runnable undo) {
    this.undo = undo;
  }

  /**
   * The worker starts cutting request {@code gen} (&gt; 0), counted as slow work until {@link
   * #slow} says otherwise.
   */
  synchronized void begin(long gen) {
    worker = Thread.currentThread();
    escapeAtStart = IJ.escapePressed();
    slow = true;
    running = gen;
  }

  /**
   * Whether the running cut is slow work (learning, building a graph, a solve from zero flow) that
   * a newer request should cut short, rather than a dynamic re-solve, which is quicker to finish
   * than to redo from zero flow after an interrupt.
   */
  void slow(boolean isSlow) {
    slow = isSlow;
  }

  /** The worker is done; an interrupt meant for this cut is cleared. */
  synchronized void end() {
    running = 0;
    Thread.interrupted();
  }

  /**
   * A request numbered {@code gen} has been made: stops the running cut if it is an older one and
   * slow work. Synchronised with {@link #begin} and {@link #end}, so it never reaches the cut that
   * follows.
   */
  synchronized void supersede(long gen) {
    Thread t = worker;
    if (running != 0 && running < gen && slow && t != null) {
      t.interrupt();
    }
  }

  /** Whether a cut is running. */
  boolean isRunning() {
    return running != 0;
  }

  /** Stops the running cut, if any (any thread). */
  void stop() {
    Thread t = worker;
    if (running != 0 && t != null) {
      t.interrupt();
    }
  }

  /** Stops the running cut if ImageJ recorded Esc since it began (any thread, e.g. a timer). */
  void poll() {
    if (running != 0 && !escapeAtStart && IJ.escapePressed()) {
      IJ.resetEscape();
      stop();
    }
  }

  /** Listens for Esc on the image's window and canvas (if shown). */
  void attach(ImagePlus imp) {
    if (imp.getWindow() != null) {
      imp.getWindow().addKeyListener(keys);
      imp.getCanvas().addKeyListener(keys);
    }
  }

  /** Stops listening on the image's window and canvas. */
  void detach(ImagePlus imp) {
    if (imp.getWindow() != null) {
      imp.getWindow().removeKeyListener(keys);
      imp.getCanvas().removeKeyListener(keys);
    }
  }

  /** Listens on {@code c} and every component inside it (key events go to the focused one). */
  void listenTo(Component c) {
    c.addKeyListener(keys);
    if (c instanceof Container box) {
      for (Component child : box.getComponents()) {
        listenTo(child);
      }
    }
  }

  private final class Keys extends KeyAdapter {
    @Override
    public void keyPressed(KeyEvent e) {
      if (e.getKeyCode() == KeyEvent.VK_ESCAPE) {
        stop();
      } else if (e.getKeyCode() == KeyEvent.VK_Z
          && (e.isControlDown() || e.isMetaDown())
          && !(e.getComponent() instanceof ij.gui.ImageCanvas)
          && !(e.getComponent() instanceof ij.gui.ImageWindow)) {
        undo.run();
      }
    }
  }
}
