package io.github.cleave.quality;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class AgreementTest {

  @Test
  void diceOfTheWorkedExample() {
    // CHECKS.md "Thresholding baseline and overlap measures": {1,0,0} vs {1,1,0} give Dice 2/3
    // (Dice, Ecology 26(3):297-302, 1945).
    assertThat(Agreement.dice(new byte[] {1, 0, 0}, new byte[] {1, 1, 0})).isEqualTo(2.0 / 3.0);
    // Jaccard of the same pair: |A∩B| / |A∪B| = 1/2 (Jaccard, New Phytologist 11(2), 1912).
    assertThat(Agreement.jaccard(new byte[] {1, 0, 0}, new byte[] {1, 1, 0})).isEqualTo(0.5);
  }

  @Test
  void jaccardEqualsDiceOverTwoMinusDiceOnRandomMasks() {
    // J = D / (2 - D): CHECKS.md (Dice 1945, Jaccard 1912).
    SplittableRandom random = new SplittableRandom(11);
    for (int trial = 0; trial < 500; trial++) {
      int n = 1 + random.nextInt(300);
      double pa = random.nextDouble();
      double pb = random.nextDouble();
      byte[] a = new byte[n];
      byte[] b = new byte[n];
      for (int i = 0; i < n; i++) {
        a[i] = (byte) (random.nextDouble() < pa ? 1 + random.nextInt(255) : 0);
        b[i] = (byte) (random.nextDouble() < pb ? 1 + random.nextInt(255) : 0);
      }
      double d = Agreement.dice(a, b);
      double j = Agreement.jaccard(a, b);
      assertThat(j).isCloseTo(d / (2 - d), within(1e-12));
      assertThat(d).isBetween(0.0, 1.0).isEqualTo(Agreement.dice(b, a));
      assertThat(Agreement.dice(a, a)).isEqualTo(1.0);
    }
  }

  @Test
  void emptyAndDisjointMasks() {
    // both empty: perfect agreement by convention (common practice, no source)
    assertThat(Agreement.dice(new byte[4], new byte[4])).isEqualTo(1.0);
    assertThat(Agreement.jaccard(new byte[4], new byte[4])).isEqualTo(1.0);
    assertThat(Agreement.dice(new byte[] {1, 0}, new byte[] {0, 1})).isZero();
    assertThat(Agreement.jaccard(new byte[] {1, 0}, new byte[] {0, 0})).isZero();
  }

  @Test
  void masksOfDifferentLengthAreRefused() {
    assertThatThrownBy(() -> Agreement.dice(new byte[2], new byte[3]))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("2 and 3");
  }
}
