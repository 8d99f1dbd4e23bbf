package io.github.cleave.image;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * {@link ByteWords} against plain byte-by-byte reference loops (common practice, no source) on
 * random sparse arrays, every start and end: the next non-zero byte, and a word's bytes in order.
 */
class ByteWordsTest {
  @Test
  void nextNonZeroAndWordsEqualPlainLoops() {
    SplittableRandom random = new SplittableRandom(20261203L);
    for (int trial = 0; trial < 200; trial++) {
      byte[] a = new byte[1 + random.nextInt(70)];
      int density = 1 + random.nextInt(20);
      for (int i = 0; i < a.length; i++) {
        a[i] = random.nextInt(density) == 0 ? (byte) (1 + random.nextInt(255)) : 0;
      }
      for (int from = 0; from <= a.length; from++) {
        for (int to = from; to <= a.length; to++) {
          int expected = from;
          while (expected < to && a[expected] == 0) {
            expected++;
          }
          assertThat(ByteWords.nextNonZero(a, from, to)).isEqualTo(expected);
        }
      }
      for (int i = 0; i + 8 <= a.length; i++) {
        long word = 0;
        for (int b = 7; b >= 0; b--) {
          word = (word << 8) | (a[i + b] & 0xFF);
        }
        assertThat(ByteWords.at(a, i)).isEqualTo(word);
      }
    }
  }
}
