package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.quality.Agreement;
import io.github.cleave.quality.OtsuBaseline;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * Quality of the whole pipeline with its default settings on the four phantoms of {@link
 * SamplePhantoms} (default seed, strokes from {@code StrokeGenerator}: at most two per class), the
 * only per-image choice being the driving channel of the two-channel phantom.
 *
 * <p>Measures: Dice coefficient of the mask against the truth (L. R. Dice, Ecology 26(3):297–302,
 * 1945); object-level F1 with objects matched one to one at intersection over union ≥ 0.5 ({@link
 * Agreement#objects}; matching at IoU ≥ 0.5: common practice, no source). Baseline: Otsu's global
 * threshold (N. Otsu, IEEE Trans. SMC-9(1):62–66, 1979), best of every channel, both polarities and
 * the luminance, must stay at Dice ≤ 0.85 so that the phantoms discriminate.
 *
 * <p>The goal is Dice ≥ 0.95 and F1 ≥ 0.9 on every phantom, and it is reached on all four at the
 * default seed; the floors below are the levels measured with the current defaults, less a small
 * margin where there is room, so that a regression shows. Measured at the default seed: nuclei Dice
 * 0.967 / F1 0.963, stained 0.980 / 1.000, two-channel 0.966 / 1.000, stack 0.950 / 1.000 (before
 * the gap between the edge band and the background ring: 0.965 / 0.963, 0.980 / 1.000, 0.964 /
 * 1.000, 0.947 / 1.000; with class priors in the refinement rounds and an edge band of 2, at least
 * one plane deep: 0.946 / 0.962, 0.981 / 1.000, 0.953 / 0.914, 0.914 / 0.880). The stack has no
 * room: its Dice is 0.9501, and the floor is the goal itself. Its remaining error is foreground
 * missed at the rim of the objects' cross-sections; every truth is reachable in principle: {@code
 * SamplePhantomsTest} requires the half-maximum contour of the noise-free blurred truth to agree at
 * Dice ≥ 0.97.
 */
class PhantomQualityTest {
  private static final List<Phantom> PHANTOMS = SamplePhantoms.all(SamplePhantoms.DEFAULT_SEED);

  /** {Dice floor, F1 floor} per phantom: goal 0.95 / 0.9. */
  private static final Map<String, double[]> FLOORS =
      Map.of(
          "nuclei", new double[] {0.96, 0.95}, // goal reached (0.967 / 0.963)
          "stained", new double[] {0.975, 0.95}, // goal reached (0.980 / 1.000)
          "two-channel", new double[] {0.96, 0.95}, // goal reached (0.966 / 1.000)
          "stack", new double[] {0.95, 0.95}); // goal reached, no margin (0.9501 / 1.000)

  @Test
  void otsuMissesEveryPhantom() {
    for (Phantom p : PHANTOMS) {
      assertThat(otsuDice(p)).as(p.name()).isLessThanOrEqualTo(0.85);
    }
  }

  @Test
  void defaultSettingsReachTheMeasuredLevels() {
    for (Phantom p : PHANTOMS) {
      Segmentation seg = Segmenter.segment(p.image(), p.seeds(), settingsFor(p));
      double dice = Agreement.dice(seg.mask(), p.truth());
      double f1 = Agreement.objects(p.truthLabels(), seg.objects().labels()).f1();
      double[] floor = FLOORS.get(p.name());
      assertThat(dice).as(p.name() + " Dice").isGreaterThanOrEqualTo(floor[0]);
      assertThat(f1).as(p.name() + " object F1").isGreaterThanOrEqualTo(floor[1]);
    }
  }

  @Test
  void maskIsTheUnionOfTheObjects() {
    Phantom p = PHANTOMS.get(2);
    Segmentation seg = Segmenter.segment(p.image(), p.seeds(), settingsFor(p));
    int[] labels = seg.objects().labels();
    byte[] mask = seg.mask();
    for (int i = 0; i < mask.length; i++) {
      assertThat(mask[i] != 0).isEqualTo(labels[i] != 0);
    }
  }

  /** The defaults, driven by the phantom's documented channel (a user's choice). */
  static SegmentationSettings settingsFor(Phantom p) {
    SegmentationSettings s = SegmentationSettings.defaults();
    if (p.image().kind() != PixelKind.RGB && p.image().channelCount() > 1) {
      s = s.withDrivingChannels(new int[] {p.drivingChannel()});
    }
    return s;
  }

  /** Best Otsu Dice over the channels, both polarities and, for RGB, the luminance. */
  private static double otsuDice(Phantom p) {
    Raster r = p.image();
    List<float[]> candidates = new java.util.ArrayList<>();
    if (r.kind() == PixelKind.RGB) {
      float[] lum = new float[r.size()];
      for (int i = 0; i < lum.length; i++) {
        lum[i] =
            (float) (0.299 * r.channel(0)[i] + 0.587 * r.channel(1)[i] + 0.114 * r.channel(2)[i]);
      }
      candidates.addAll(List.of(r.channel(0), r.channel(1), r.channel(2), lum));
    } else {
      candidates.add(r.channel(p.drivingChannel()));
    }
    double best = 0;
    for (float[] values : candidates) {
      byte[] mask = OtsuBaseline.mask(values);
      best = Math.max(best, Agreement.dice(p.truth(), mask));
      for (int i = 0; i < mask.length; i++) {
        mask[i] = (byte) (1 - mask[i]);
      }
      best = Math.max(best, Agreement.dice(p.truth(), mask));
    }
    return best;
  }
}
