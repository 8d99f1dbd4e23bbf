package io.github.cleave.bench;

import java.util.Arrays;

/** Small helpers for the benchmark: medians and memory readings. */
final class Timing {
  private Timing() {}

  static double medianMs(long[] nanos) {
    long[] sorted = nanos.clone();
    Arrays.sort(sorted);
    int n = sorted.length;
    double median = n % 2 == 1 ? sorted[n / 2] : (sorted[n / 2 - 1] + sorted[n / 2]) / 2.0;
    return median / 1e6;
  }

  /** Java heap in use after a full collection, in bytes. */
  static long heapUsed() {
    Runtime rt = Runtime.getRuntime();
    for (int i = 0; i < 3; i++) {
      System.gc();
    }
    return rt.totalMemory() - rt.freeMemory();
  }

  /** Resident set size of this process (Linux /proc), in bytes; -1 where unavailable. */
  static long residentBytes() {
    try {
      for (String line : java.nio.file.Files.readAllLines(java.nio.file.Path.of("/proc/self/status"))) {
        if (line.startsWith("VmRSS:")) {
          return Long.parseLong(line.replaceAll("[^0-9]", "")) * 1024;
        }
      }
    } catch (java.io.IOException | RuntimeException e) {
      return -1;
    }
    return -1;
  }
}
