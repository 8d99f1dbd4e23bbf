package io.github.cleave.model;

/**
 * {@code exp(x)} for {@code x ≤ 0} in plain double arithmetic, so that it gives the same bits on
 * every Java platform (unlike {@link Math#exp}, which may use processor-specific code) and is
 * cheaper than {@link StrictMath#exp}. Method: {@code e^x = 2^i · e^y} with {@code i =
 * rint(x·log₂e)} and {@code |y| ≤ ½ ln 2}, {@code e^y} by its Taylor polynomial of degree 8;
 * relative error below 10⁻⁹ (the first omitted term is {@code 0.347⁹ / 9! ≈ 6·10⁻¹¹}). Returns 0
 * below −700.
 */
final class Exponentials {
  private static final double LOG2_E = 1.4426950408889634;
  private static final double LN_2 = 0.6931471805599453;

  private Exponentials() {}

  static double expNonPositive(double x) {
    if (!(x >= -700)) {
      return x != x ? Double.NaN : 0;
    }
    double t = x * LOG2_E;
    double i = Math.rint(t);
    double y = (t - i) * LN_2;
    double p =
        1
            + y
                * (1
                    + y
                        * (1.0 / 2
                            + y
                                * (1.0 / 6
                                    + y
                                        * (1.0 / 24
                                            + y
                                                * (1.0 / 120
                                                    + y
                                                        * (1.0 / 720
                                                            + y * (1.0 / 5040 + y / 40320)))))));
    return p * Double.longBitsToDouble((long) ((int) i + 1023) << 52);
  }
}
