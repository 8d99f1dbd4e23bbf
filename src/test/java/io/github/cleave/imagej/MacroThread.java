package io.github.cleave.imagej;

import ij.ImagePlus;
import ij.Macro;
import ij.WindowManager;
import ij.macro.Interpreter;
import java.util.concurrent.Callable;

/**
 * Runs test code the way ImageJ runs a command called from a macro: on a thread whose name starts
 * with {@code Run$_} (the only threads {@link Macro#getOptions()} answers), with the given macro
 * options and current image, in batch mode so that shown images stay in memory (IMAGEJ-NOTES.md).
 */
final class MacroThread {
  private MacroThread() {}

  static <T> T call(String options, ImagePlus current, Callable<T> body) throws Exception {
    Object[] result = new Object[1];
    Exception[] failure = new Exception[1];
    Thread t =
        new Thread(
            () -> {
              boolean batch = Interpreter.batchMode;
              Interpreter.batchMode = true;
              Macro.setOptions(Thread.currentThread(), options);
              WindowManager.setTempCurrentImage(current);
              try {
                result[0] = body.call();
              } catch (Exception e) {
                failure[0] = e;
              } finally {
                WindowManager.setTempCurrentImage(null);
                Macro.setOptions(Thread.currentThread(), null);
                Interpreter.batchMode = batch;
              }
            },
            "Run$_cleave-test");
    t.start();
    t.join();
    if (failure[0] != null) {
      throw failure[0];
    }
    @SuppressWarnings("unchecked")
    T r = (T) result[0];
    return r;
  }
}
