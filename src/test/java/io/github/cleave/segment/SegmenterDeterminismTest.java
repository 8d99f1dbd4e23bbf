package io.github.cleave.segment;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import org.junit.jupiter.api.Test;

/**
 * The pipeline is a function of its inputs: segmenting the same image with the same seeds and
 * settings twice gives identical masks, labels and energies, bit for bit (the contract of {@link
 * Segmenter}).
 */
class SegmenterDeterminismTest {
  @Test
  void segmentingTwiceGivesIdenticalMasksAndLabels() {
    for (long seed : new long[] {SamplePhantoms.DEFAULT_SEED, 7}) {
      for (Phantom p :
          new Phantom[] {
            SamplePhantoms.twoChannel(seed, 128, 128), SamplePhantoms.stack(seed, 64, 64, 16)
          }) {
        SegmentationSettings s = PhantomQualityTest.settingsFor(p);
        Segmentation a = Segmenter.segment(p.image(), p.seeds(), s);
        Segmentation b = Segmenter.segment(p.image(), p.seeds(), s);
        assertThat(b.mask()).as(p.name()).isEqualTo(a.mask());
        assertThat(b.objects().labels()).as(p.name()).isEqualTo(a.objects().labels());
        assertThat(b.flowValue()).as(p.name()).isEqualTo(a.flowValue());
      }
    }
  }
}
