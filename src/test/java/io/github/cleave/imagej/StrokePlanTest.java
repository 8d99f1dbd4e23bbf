package io.github.cleave.imagej;

import static org.assertj.core.api.Assertions.assertThat;

import ij.IJ;
import ij.ImagePlus;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.io.ImageFiles;
import io.github.cleave.quality.Agreement;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;

/**
 * What the GUI test paints is enough: two brush strokes taken from the sample's seed image give a
 * mask within Dice 0.9 of the sample's ground truth (the threshold of the GUI test).
 */
class StrokePlanTest {
  @Test
  void twoStrokesSegmentTheNucleiSample() {
    Path samples = Path.of("sample-images");
    StrokePlan plan = StrokePlan.of(samples.resolve("nuclei.seeds.tif"));
    SeedLabels seeds = plan.strokes(512, 512, 3).labels();
    var image = ImageFiles.read(samples.resolve("nuclei.tif"));
    var result = Segmenter.segment(image.raster(), seeds, SegmentationSettings.defaults());
    ImagePlus truth = IJ.openImage(samples.resolve("nuclei.truth.tif").toString());
    double dice = Agreement.dice(result.mask(), (byte[]) truth.getProcessor().getPixels());
    assertThat(dice).isGreaterThanOrEqualTo(0.9);
  }
}
