package io.github.cleave.segment;

import io.github.cleave.energy.CapacityScale;
import io.github.cleave.energy.ContrastScale;
import io.github.cleave.energy.CutProblem;
import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.flow.Neighborhood;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.model.LikelihoodModel;
import io.github.cleave.model.ModelLearner;
import io.github.cleave.objects.ObjectLabels;
import io.github.cleave.objects.ObjectMeasurement;
import io.github.cleave.objects.ObjectMeasurements;
import io.github.cleave.objects.ObjectPipeline;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CancellationException;

/**
 * The one segmentation pipeline that every front door calls: image, seeds and settings in, one
 * {@link Segmentation} out, bit for bit the same whoever calls it.
 *
 * <ol>
 *   <li>Choose the driving channels; flatten illumination if asked or, in AUTO mode, if the image
 *       shows a strong gradient ({@link Illumination}).
 *   <li>Learn the likelihood of each class from its seed voxels ({@link ModelLearner}), or take
 *       them from a saved {@link SegmentationModel}.
 *   <li>Build the grid graph of the energy ({@link CutProblem}) and cut it with the grid max-flow
 *       engine; the source side is the foreground mask. Re-learn the likelihoods from the cut and
 *       cut again for the refinement rounds ({@link RefinedCut}), then place the edges at half
 *       maximum by one more cut in a thin band around them ({@link EdgeRefinement}).
 *   <li>Drop specks from the mask ({@link MaskCleaning}), form objects from it (holes, splitting of
 *       touching objects, size and edge filters) and measure them on the raw values of the measured
 *       channels, in calibrated units. The mask returned is the union of the kept objects; the
 *       energy is that of the cut before this step.
 * </ol>
 *
 * <p>Stateless and thread-safe: separate calls may run in parallel. A call whose thread is
 * interrupted stops and throws {@link CancellationException}.
 */
public final class Segmenter {
  private Segmenter() {}

  /**
   * Learns from the seeds of {@code image} and segments it, the seeds acting as hard constraints.
   */
  public static Segmentation segment(
      Raster image, SeedLabels seeds, SegmentationSettings settings) {
    Learned learned = learnWithFeatures(image, seeds, settings);
    return applyTo(
        learned.model,
        learned.calibrated,
        seeds,
        learned.features,
        learned.flattenMs,
        learned.learnMs,
        learned.warnings);
  }

  /**
   * Learns a model from the seeds of {@code image} (and the refinement rounds of its cut), for
   * {@link #apply} to other images.
   */
  public static SegmentationModel learn(
      Raster image, SeedLabels seeds, SegmentationSettings settings) {
    Learned learned = learnWithFeatures(image, seeds, settings);
    SegmentationModel model = learned.model;
    if (model.likelihood().classCount() > 2) {
      return model.withLikelihood(
          MultiClassCut.run(model, learned.calibrated, seeds, learned.features).likelihood());
    }
    RefinedCut.Outcome refined = refinedCut(model, learned.calibrated, seeds, learned.features);
    return model.withLikelihood(refined.likelihood());
  }

  /**
   * Segments {@code image} with a saved model: the model's likelihoods drive the cut as they are
   * when its refinement rounds already re-learned them on the learning image (every model that
   * {@link #learn} or {@link #segment} gives), else they are re-estimated on this image for the
   * model's refinement rounds ({@code RefinedCut}; {@link SegmentationModel#roundsWhenApplied});
   * {@code seeds} (may be null) are hard constraints.
   *
   * @throws BadInputException if the image has another channel count than the model's, or seeds do
   *     not fit the image
   */
  public static Segmentation apply(SegmentationModel model, Raster image, SeedLabels seeds) {
    if (image.channelCount() != model.imageChannels()) {
      throw new BadInputException(
          String.format(
              Locale.ROOT,
              "the image has %d channel(s) but the model was learned on an image with %d: apply"
                  + " it to images like the one it was learned on, or learn a new model",
              image.channelCount(),
              model.imageChannels()));
    }
    SeedLabels hard =
        seeds == null
            ? SeedLabels.empty(image.width(), image.height(), image.depth())
            : SegmentInputs.checkSeedClasses(
                SegmentInputs.checkSeeds(image, seeds), model.likelihood().classCount());
    List<String> warnings = new ArrayList<>();
    VoxelSize size = SegmentInputs.resolveVoxelSize(image, model.settings(), warnings);
    if (size.differsFrom(model.voxelSize())) {
      warnings.add(
          String.format(
              Locale.ROOT,
              "the image's pixel size (%s x %s x %s %s) differs from the model's (%s x %s x %s %s):"
                  + " boundary lengths and size limits are scaled to this image",
              size.x(),
              size.y(),
              size.z(),
              size.unit(),
              model.voxelSize().x(),
              model.voxelSize().y(),
              model.voxelSize().z(),
              model.voxelSize().unit()));
    }
    if (image.kind() != model.pixelKind()) {
      warnings.add(
          "the image's pixels are "
              + image.kind()
              + " but the model was learned on "
              + model.pixelKind()
              + " pixels: its likelihoods may not fit this image's value range");
    }
    Raster calibrated = image.withVoxelSize(size);
    long start = System.nanoTime();
    Raster features = SegmentInputs.features(calibrated, model.settings());
    if (model.flatten()) {
      features =
          Illumination.flattened(
              features, model.settings().flattenRadius(), model.lightBackground());
    }
    double flattenMs = millisSince(start);
    return applyTo(model, calibrated, hard, features, flattenMs, 0, warnings);
  }

  private record Learned(
      SegmentationModel model,
      Raster calibrated,
      Raster features,
      double flattenMs,
      double learnMs,
      List<String> warnings) {}

  private static Learned learnWithFeatures(
      Raster image, SeedLabels seeds, SegmentationSettings settings) {
    SegmentInputs.checkSeeds(image, seeds);
    List<String> warnings = new ArrayList<>();
    VoxelSize size = SegmentInputs.resolveVoxelSize(image, settings, warnings);
    Raster calibrated = image.withVoxelSize(size);
    SegmentationSettings resolved =
        settings.withDrivingChannels(SegmentInputs.drivingChannels(image, settings));
    long start = System.nanoTime();
    Raster features = SegmentInputs.features(calibrated, resolved);
    boolean light = Illumination.isLightBackground(features, seeds);
    boolean flatten = resolved.illumination() == IlluminationMode.ON;
    if (resolved.illumination() != IlluminationMode.OFF) {
      Illumination.Flattening f =
          Illumination.flatten(features, seeds, resolved.flattenRadius(), light);
      if (resolved.illumination() == IlluminationMode.AUTO) {
        flatten = Illumination.shouldFlatten(f);
        warnings.add(
            String.format(
                Locale.ROOT,
                "illumination %s: trend strength %s (flattened from %s%s)%s",
                flatten ? "flattened" : "left as it is",
                formatStrengths(f.trendStrength()),
                Illumination.STRONG_GRADIENT,
                light ? ", never on a light background" : "",
                f.keepsObjects()
                    ? ""
                    : "; flattening would remove the objects themselves: if the illumination is"
                        + " uneven, use a --flatten-radius larger than the largest object"));
      } else if (!f.keepsObjects()) {
        warnings.add(
            "flattening removed more than half of the contrast between the seeds: the objects"
                + " are larger than the flattening radius; choose a larger radius");
      }
      if (flatten) {
        features = f.flattened();
      }
    }
    double flattenMs = millisSince(start);
    start = System.nanoTime();
    LikelihoodModel likelihood = ModelLearner.learn(features, seeds, resolved.modelKind());
    Neighborhood nb = SegmentInputs.neighborhood(image, resolved);
    double sigma =
        Double.isNaN(resolved.contrastScale())
            ? ContrastScale.estimate(features, nb)
            : resolved.contrastScale();
    double learnMs = millisSince(start);
    SegmentationModel model =
        new SegmentationModel(
            likelihood,
            resolved,
            sigma,
            flatten,
            light,
            image.channelCount(),
            image.kind(),
            size,
            SoftwareVersion.get(),
            false);
    return new Learned(model, calibrated, features, flattenMs, learnMs, warnings);
  }

  private static Segmentation applyTo(
      SegmentationModel model,
      Raster image,
      SeedLabels seeds,
      Raster features,
      double flattenMs,
      double learnMs,
      List<String> warnings) {
    if (model.likelihood().classCount() > 2) {
      return MultiClassSegmenter.applyTo(
          model, image, seeds, features, flattenMs, learnMs, warnings);
    }
    SegmentationSettings settings = model.settings();
    EnergyParameters parameters = energyParameters(model, image);
    RefinedCut.Outcome refined = refinedCut(model, image, seeds, features);
    CutOutcome cut = refined.cut();
    CutOutcome edges =
        EdgeRefinement.refine(features, cut.mask, seeds, parameters, settings.perPlane());
    SegmentationModel finalModel = model.withLikelihood(refined.likelihood());
    long start = System.nanoTime();
    byte[] cleaned =
        MaskCleaning.withoutSpecks(
            edges.mask,
            image.width(),
            image.height(),
            image.depth(),
            SegmentationSettings.SPECK_VOXELS,
            seeds);
    ObjectLabels objects =
        ObjectPipeline.run(
            cleaned,
            image.width(),
            image.height(),
            image.depth(),
            image.voxelSize(),
            settings.objects(),
            foregroundSeedMask(seeds));
    byte[] mask = MaskCleaning.union(objects);
    double objectsMs = millisSince(start);
    start = System.nanoTime();
    List<ObjectMeasurement> measurements =
        ObjectMeasurements.measure(
            objects, image.voxelSize(), image, SegmentInputs.measuredChannels(image, settings));
    double measureMs = millisSince(start);
    return new Segmentation(
        mask,
        objects,
        measurements,
        CapacityScale.toNats(cut.flow),
        cut.flow,
        finalModel,
        image.voxelSize(),
        new PhaseTimings(
            flattenMs,
            learnMs + refined.learnMs(),
            refined.costsMs(),
            cut.buildMs + edges.buildMs,
            cut.solveMs + edges.solveMs,
            objectsMs,
            measureMs),
        warnings,
        null);
  }

  static EnergyParameters energyParameters(SegmentationModel model, Raster image) {
    SegmentationSettings settings = model.settings();
    Neighborhood nb = SegmentInputs.neighborhood(image, settings);
    return new EnergyParameters(
        settings.boundaryPenalty(), model.contrastScale(), nb, image.voxelSize());
  }

  /** The cut of the model's refinement rounds on {@code image}. */
  private static RefinedCut.Outcome refinedCut(
      SegmentationModel model, Raster image, SeedLabels seeds, Raster features) {
    SegmentationSettings settings = model.settings();
    return RefinedCut.run(
        features,
        seeds,
        model.likelihood(),
        settings.modelKind(),
        model.roundsWhenApplied(),
        settings.perPlane(),
        energyParameters(model, image));
  }

  /** The mask and flow of a cut with the time spent building and solving. */
  record CutOutcome(byte[] mask, long flow, double buildMs, double solveMs) {}

  static CutOutcome cutVolume(
      Raster features, float[][] costs, SeedLabels seeds, EnergyParameters parameters) {
    return new VolumeCut(features, seeds, parameters).cut(costs);
  }

  private static byte[] foregroundSeedMask(SeedLabels seeds) {
    byte[] labels = seeds.labels();
    byte[] marks = new byte[labels.length];
    for (int i = SeedLabels.nextLabelled(labels, 0);
        i < labels.length;
        i = SeedLabels.nextLabelled(labels, i + 1)) {
      if (labels[i] == SeedLabels.FOREGROUND) {
        marks[i] = (byte) 255;
      }
    }
    return marks;
  }

  private static String formatStrengths(double[] strengths) {
    StringBuilder sb = new StringBuilder();
    for (double s : strengths) {
      if (sb.length() > 0) {
        sb.append(", ");
      }
      sb.append(String.format(Locale.ROOT, "%.2f", s));
    }
    return sb.toString();
  }

  static double millisSince(long start) {
    return (System.nanoTime() - start) / 1e6;
  }

  @SuppressWarnings("AssertWithSideEffects")
  static boolean assertionsEnabled() {
    boolean on = false;
    assert on = true;
    return on;
  }
}
