package io.github.cleave.energy;

import io.github.cleave.flow.Neighborhood;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

/**
 * Remembers the length weights of recent calibrations: the 3D solid angles cost a numerical
 * integration (tens of milliseconds) that an interactive re-solve or a folder run must not repeat.
 * Thread-safe; returns copies.
 */
final class LengthWeightCache {
  private static final int MAX_ENTRIES = 64;
  private static final Map<String, double[]> CACHE = new ConcurrentHashMap<>();

  private LengthWeightCache() {}

  static double[] weights(Neighborhood nb, double sx, double sy, double sz) {
    String key =
        nb.name()
            + ':'
            + Double.doubleToLongBits(sx)
            + ':'
            + Double.doubleToLongBits(sy)
            + ':'
            + Double.doubleToLongBits(sz);
    double[] w = CACHE.get(key);
    if (w == null) {
      w = LengthWeights.of(nb, sx, sy, sz);
      if (CACHE.size() >= MAX_ENTRIES) {
        CACHE.clear();
      }
      CACHE.put(key, w);
    }
    return w.clone();
  }
}
