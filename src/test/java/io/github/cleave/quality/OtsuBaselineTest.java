package io.github.cleave.quality;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class OtsuBaselineTest {

  // CHECKS.md "Thresholding baseline": this 5x5 image gives Otsu threshold 2, foreground > 2
  // (scikit-image test suite; Otsu, IEEE Trans. SMC-9(1), 1979).
  private static final float[] FIVE_BY_FIVE = {
    0, 0, 1, 3, 5, 0, 1, 4, 3, 4, 1, 2, 5, 4, 1, 2, 4, 5, 2, 1, 4, 5, 1, 0, 0
  };

  @Test
  void fiveByFiveImageGivesForegroundAboveTwo() {
    Raster image = Raster.grey(5, 5, 1, FIVE_BY_FIVE, VoxelSize.PIXELS, PixelKind.GREY8);
    byte[] mask = OtsuBaseline.mask(image, 0);
    for (int i = 0; i < FIVE_BY_FIVE.length; i++) {
      assertThat(mask[i])
          .as("pixel %d value %s", i, FIVE_BY_FIVE[i])
          .isEqualTo((byte) (FIVE_BY_FIVE[i] > 2 ? 1 : 0));
    }
    // values 0..5 over 256 bins: 2 falls in bin 102, 3 in bin 153; the threshold lies between
    assertThat(OtsuBaseline.thresholdBin(FIVE_BY_FIVE)).isBetween(102, 152);
  }

  @Test
  void maskIsUnchangedByOffsetAndPositiveScale() {
    SplittableRandom random = new SplittableRandom(3);
    for (int trial = 0; trial < 100; trial++) {
      int n = 10 + random.nextInt(500);
      float[] v = new float[n];
      for (int i = 0; i < n; i++) {
        v[i] = random.nextInt(4) == 0 ? 200 + random.nextInt(50) : random.nextInt(120);
      }
      float[] w = new float[n];
      for (int i = 0; i < n; i++) {
        w[i] = 4 * v[i] + 1000;
      }
      assertThat(OtsuBaseline.mask(w)).isEqualTo(OtsuBaseline.mask(v));
    }
  }

  @Test
  void constantImageGivesEmptyMask() {
    assertThat(OtsuBaseline.mask(new float[] {7, 7, 7})).containsOnly(0);
  }
}
