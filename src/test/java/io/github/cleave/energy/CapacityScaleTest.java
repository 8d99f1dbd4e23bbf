package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The quantisation of {@link CapacityScale} is the documented rule, rounding to the nearest unit
 * with ties to even as {@link Math#rint} does (its definition in the Java SE API), clamped to
 * {@code 0 .. Integer.MAX_VALUE}, on random values of every magnitude and on the exact ties.
 */
class CapacityScaleTest {
  private static int reference(double nats) {
    double units = Math.rint(nats * CapacityScale.UNITS_PER_NAT);
    return units >= Integer.MAX_VALUE ? Integer.MAX_VALUE : (int) Math.max(0, units);
  }

  @Test
  void roundsAsRintOnRandomValuesAndTies() {
    SplittableRandom random = new SplittableRandom(20261202L);
    for (int i = 0; i < 200_000; i++) {
      double nats =
          switch (i % 4) {
            case 0 -> random.nextDouble(-1, 40); // regional costs
            case 1 -> Math.scalb(random.nextDouble(), random.nextInt(-30, 40)); // any magnitude
            case 2 -> (random.nextInt(1 << 20) + 0.5) / CapacityScale.UNITS_PER_NAT; // exact ties
            default -> (float) random.nextDouble(0, 100); // float costs widened
          };
      assertThat(CapacityScale.toCapacity(nats)).as("%s nats", nats).isEqualTo(reference(nats));
    }
    double[] edges = {
      0,
      -0.0,
      Double.MIN_VALUE,
      0.5 / 256,
      1.5 / 256,
      2.5 / 256,
      Double.NaN,
      Double.POSITIVE_INFINITY,
      Double.NEGATIVE_INFINITY,
      (Integer.MAX_VALUE - 0.5) / 256,
      (Integer.MAX_VALUE - 0.6) / 256,
      Integer.MAX_VALUE / 256.0,
      1e300
    };
    for (double nats : edges) {
      assertThat(CapacityScale.toCapacity(nats)).as("%s nats", nats).isEqualTo(reference(nats));
    }
  }
}
