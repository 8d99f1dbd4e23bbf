package io.github.cleave.segment;

import io.github.cleave.energy.CapacityScale;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.objects.ObjectMeasurement;
import io.github.cleave.objects.ObjectMeasurements;
import java.util.List;

/**
 * The part of {@link Segmenter} that differs for three or more classes: the cut is {@link
 * MultiClassCut} (alpha-expansion with refinement rounds) instead of the two-class cut and its edge
 * placement, and the objects are formed per class ({@link ClassObjects}). Everything before the cut
 * (channels, illumination, learning) and after the objects (measurements on the raw values of the
 * measured channels) is the two-class pipeline's. Stateless.
 */
final class MultiClassSegmenter {
  private MultiClassSegmenter() {}

  static Segmentation applyTo(
      SegmentationModel model,
      Raster image,
      SeedLabels seeds,
      Raster features,
      double flattenMs,
      double learnMs,
      List<String> warnings) {
    SegmentationSettings settings = model.settings();
    int classCount = model.likelihood().classCount();
    RefinedCut.Outcome refined = MultiClassCut.run(model, image, seeds, features);
    Segmenter.CutOutcome cut = refined.cut();
    long start = System.nanoTime();
    ClassObjects.Formed formed =
        ClassObjects.form(
            cut.mask(),
            classCount,
            image.width(),
            image.height(),
            image.depth(),
            image.voxelSize(),
            settings.objects(),
            seeds);
    double objectsMs = Segmenter.millisSince(start);
    start = System.nanoTime();
    List<ObjectMeasurement> measurements =
        ObjectMeasurements.measure(
            formed.objects(),
            image.voxelSize(),
            image,
            SegmentInputs.measuredChannels(image, settings));
    double measureMs = Segmenter.millisSince(start);
    return new Segmentation(
        MaskCleaning.union(formed.objects()),
        formed.objects(),
        measurements,
        CapacityScale.toNats(cut.flow()),
        cut.flow(),
        model.withLikelihood(refined.likelihood()),
        image.voxelSize(),
        new PhaseTimings(
            flattenMs,
            learnMs + refined.learnMs(),
            refined.costsMs(),
            cut.buildMs(),
            cut.solveMs(),
            objectsMs,
            measureMs),
        warnings,
        new ClassMap(classCount, cut.mask(), formed.objectClasses()));
  }
}
