package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The transform from a line's nonzero samples equals the whole-line transform, bit for bit. */
class ParabolaEnvelopeTest {

  @Test
  void sparseLinesGiveTheWholeLineValues() {
    SplittableRandom rnd = new SplittableRandom(31);
    double[] odd = {1e-170, 1e-9, 0.1, 0.2, 1 / 3.0, 0.6, 1, 2.5, 7, 1e6, 1e150};
    for (int t = 0; t < 3000; t++) {
      int length = rnd.nextInt(1, rnd.nextBoolean() ? 12 : 300);
      double s = rnd.nextInt(3) == 0 ? odd[rnd.nextInt(odd.length)] : rnd.nextDouble(0.05, 4);
      double[] line = new double[length];
      double density = rnd.nextDouble(0, 1);
      for (int q = 0; q < length; q++) {
        if (rnd.nextDouble() < density) { // unreached, or a squared distance already found
          line[q] =
              rnd.nextBoolean()
                  ? Double.POSITIVE_INFINITY
                  : Math.pow(rnd.nextInt(1, 40) * s, 2) + (rnd.nextBoolean() ? 0 : s * s);
        }
      }
      int m = 0;
      int[] at = new int[length];
      double[] in = new double[length];
      for (int q = 0; q < length; q++) {
        if (line[q] != 0) {
          at[m] = q;
          in[m++] = line[q];
        }
      }
      ParabolaEnvelope envelope = new ParabolaEnvelope(length, s);
      int[] outAt = new int[length];
      double[] out = new double[length];
      int c = envelope.sparse(at, in, m, outAt, out);
      double[] sparse = new double[length];
      for (int i = 0; i < c; i++) {
        sparse[outAt[i]] = out[i];
      }
      double[] whole = line.clone();
      envelope.transform(whole, 0, 1, length);
      assertThat(sparse).as("trial %d, s = %s, %s", t, s, Arrays.toString(line)).isEqualTo(whole);
    }
  }
}
