package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.quality.Agreement;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import org.junit.jupiter.api.Test;

/**
 * Applying a saved model: a model whose likelihoods its refinement rounds already learned from the
 * learning image's cut is applied as it is, and segments other fields as well as re-learning on
 * each field would. Quality is measured against the generated truth of the phantoms (Dice, as in
 * {@code PhantomQualityTest}).
 */
class ModelApplicationTest {

  @Test
  void aRefinedModelRunsNoRoundsAndARelearnedOneRunsTheSetting() {
    Phantom learnFrom = SamplePhantoms.nuclei(21, 160, 160);
    SegmentationModel model =
        Segmenter.learn(learnFrom.image(), learnFrom.seeds(), SegmentationSettings.defaults());
    assertThat(model.likelihoodRefined()).isTrue();
    assertThat(model.roundsWhenApplied()).isZero();
    SegmentationModel relearned = model.relearnedOnEachImage();
    assertThat(relearned.likelihoodRefined()).isFalse();
    assertThat(relearned.roundsWhenApplied()).isEqualTo(model.settings().refinementRounds());
    assertThat(relearned.likelihood()).isSameAs(model.likelihood());
    // as is = re-learned with zero rounds, bit for bit, on other fields
    SegmentationModel zeroRounds =
        new SegmentationModel(
            model.likelihood(),
            model.settings().withRefinementRounds(0),
            model.contrastScale(),
            model.flatten(),
            model.lightBackground(),
            model.imageChannels(),
            model.pixelKind(),
            model.voxelSize(),
            model.softwareVersion(),
            false);
    for (long seed = 30; seed < 34; seed++) {
      Phantom field = SamplePhantoms.nuclei(seed, 160, 160);
      assertThat(Segmenter.apply(model, field.image(), null).mask())
          .isEqualTo(Segmenter.apply(zeroRounds, field.image(), null).mask());
    }
  }

  @Test
  void appliedAsItIsItSegmentsOtherFieldsAsWellAsRelearningOnEach() {
    // measured on twelve 512 x 512 fields: 0.978 against 0.979 evenly lit, 0.969 against 0.970
    // with the illumination ramp; here smaller fields, a bound with some room
    for (boolean evenlyLit : new boolean[] {true, false}) {
      Phantom learnFrom = phantom(evenlyLit, SamplePhantoms.DEFAULT_SEED);
      SegmentationModel model =
          Segmenter.learn(learnFrom.image(), learnFrom.seeds(), SegmentationSettings.defaults());
      double asIs = 0;
      double relearned = 0;
      int fields = 4;
      for (int i = 0; i < fields; i++) {
        Phantom field = phantom(evenlyLit, 700 + i);
        double d =
            Agreement.dice(Segmenter.apply(model, field.image(), null).mask(), field.truth());
        // one 256 x 256 ramp field reaches only 0.917 either way (a dim nucleus at the dark end)
        assertThat(d).as("field %d, evenly lit %s", i, evenlyLit).isGreaterThan(0.9);
        asIs += d;
        relearned +=
            Agreement.dice(
                Segmenter.apply(model.relearnedOnEachImage(), field.image(), null).mask(),
                field.truth());
      }
      assertThat(asIs / fields).isGreaterThan(relearned / fields - 0.005);
    }
  }

  private static Phantom phantom(boolean evenlyLit, long seed) {
    return evenlyLit
        ? SamplePhantoms.nucleiEvenlyLit(seed, 256, 256)
        : SamplePhantoms.nuclei(seed, 256, 256);
  }
}
