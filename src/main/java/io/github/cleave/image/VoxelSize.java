package io.github.cleave.image;

import java.util.Locale;

/**
 * The physical size of one pixel or voxel: width along x, height along y, depth along z (1 for a
 * single plane), all in {@code unit}. {@code assumed} is true when the image file carried no
 * calibration and the sizes came from settings or defaults; outputs say so.
 *
 * <p>Immutable value type.
 */
public record VoxelSize(double x, double y, double z, String unit, boolean assumed) {

  /** One pixel per unit "pixel" on every axis, assumed. */
  public static final VoxelSize PIXELS = new VoxelSize(1, 1, 1, "pixel", true);

  /**
   * @throws IllegalArgumentException if a size is not a positive finite number or the unit is empty
   */
  public VoxelSize {
    for (double s : new double[] {x, y, z}) {
      if (!(s > 0) || Double.isInfinite(s)) {
        throw new IllegalArgumentException(
            String.format(
                Locale.ROOT,
                "voxel size %s x %s x %s: every size must be a positive finite number",
                x,
                y,
                z));
      }
    }
    if (unit == null || unit.isBlank()) {
      throw new IllegalArgumentException("voxel size: the unit must not be empty");
    }
  }

  /** Area of one pixel in {@code unit²}. */
  public double pixelArea() {
    return x * y;
  }

  /** Volume of one voxel in {@code unit³}. */
  public double voxelVolume() {
    return x * y * z;
  }

  /** True when the two sizes differ by more than one part in 10⁴ on some axis, or in unit. */
  public boolean differsFrom(VoxelSize other) {
    return !unit.equals(other.unit)
        || relativeDifference(x, other.x) > 1e-4
        || relativeDifference(y, other.y) > 1e-4
        || relativeDifference(z, other.z) > 1e-4;
  }

  private static double relativeDifference(double a, double b) {
    return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));
  }
}
