package io.github.cleave.batch;

/**
 * Told about a folder run's progress: after each file, from the worker thread that finished it
 * (calls are serialised, never concurrent). Must return quickly and must not throw.
 */
@FunctionalInterface
public interface BatchListener {
  /** Does nothing. */
  BatchListener NONE = p -> {};

  /** Called after each file with the run's progress so far. */
  void progress(BatchProgress progress);
}
