package io.github.cleave.energy;

/**
 * The fixed conversion from real-valued energy (in nats, the unit of {@code −ln} probabilities) to
 * the integer capacities of the max-flow engine: one nat is {@value #UNITS_PER_NAT} capacity units,
 * rounded to the nearest unit.
 *
 * <p>The scale is a constant, never derived from the image (no normalisation by the largest cost),
 * so a voxel's capacities depend only on its own costs and its neighbours: cropping an image or
 * cutting it into different tiles leaves the capacities of every interior arc unchanged, and with
 * the same learned model and contrast scale the segmentation of the shared region stays the same.
 * Rounding changes a cut's cost by at most half a unit per arc (1/512 nat), far below the costs
 * that decide a boundary. At 256 units per nat the regional costs (at most 30 nats, 7680 units) and
 * boundary weights up to a boundary penalty of about 100 fit the engine's compact 16-bit residuals
 * (at most 32767 per arc); larger values still work, with 32-bit residuals.
 */
public final class CapacityScale {
  /** Capacity units per nat. */
  public static final int UNITS_PER_NAT = 256;

  private static final double ROUNDING_SHIFT = 0x1p52;

  private CapacityScale() {}

  /** The capacity of an energy of {@code nats} (≥ 0), rounded; saturates at Integer.MAX_VALUE. */
  public static int toCapacity(double nats) {
    // Clamped to 0 .. 2^31 − 1 (NaN stays NaN and converts to 0), then rounded as Math.rint
    // rounds: above 2^52 the spacing of doubles is 1, so the sum is rounded to the nearest whole
    // number, ties to even. No branch, so loops over many voxels run without mispredictions.
    double units = Math.min(Math.max(nats * UNITS_PER_NAT, 0), Integer.MAX_VALUE);
    return (int) ((units + ROUNDING_SHIFT) - ROUNDING_SHIFT);
  }

  /** The energy in nats of a capacity sum. */
  public static double toNats(long units) {
    return units / (double) UNITS_PER_NAT;
  }
}
