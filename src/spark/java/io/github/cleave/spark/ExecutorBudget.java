package io.github.cleave.spark;

import io.github.cleave.batch.MemoryBudget;

/**
 * The heap budget of one executor JVM, shared by all its task threads (and, in local mode, by the
 * driver's tasks): {@link MemoryBudget#of} with the default share of the heap that is free when the
 * first task asks. Made once per JVM; the per-file function itself keeps no such state.
 */
final class ExecutorBudget {
  private static MemoryBudget budget; // guarded by ExecutorBudget.class

  private ExecutorBudget() {}

  static synchronized MemoryBudget get() {
    if (budget == null) {
      budget = MemoryBudget.of(0);
    }
    return budget;
  }
}
