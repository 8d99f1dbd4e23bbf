package io.github.cleave.segment;

import io.github.cleave.energy.AlphaExpansion;
import io.github.cleave.energy.EnergyParameters;
import io.github.cleave.energy.PottsEnergy;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.model.LikelihoodModel;
import io.github.cleave.model.ModelKind;

/**
 * The cut into three or more classes: alpha-expansion over the Potts energy ({@link
 * AlphaExpansion}; Boykov, Veksler and Zabih, IEEE TPAMI 23(11), 2001), with the same iterated
 * re-estimation of the likelihoods as the two-class {@link RefinedCut}: learn every class again
 * from the voxels the cut gave it, away from the class boundaries ({@link RefinedCut#BAND}), seeds
 * keeping their label, and cut again, for the model's rounds or until the class map no longer
 * changes. A stack cut plane by plane runs each plane as its own energy ({@link PlaneCuts}).
 *
 * <p>Each cut starts from the background ({@link AlphaExpansion#backgroundStart}) and runs at most
 * {@link AlphaExpansion#DEFAULT_MAX_CYCLES} cycles of expansion moves, one max-flow problem per
 * class and cycle. Expansion stops at a local minimum within twice the global one for the Potts
 * model (BVZ 2001, Theorem 6.1); the two-class case is left to the exact cut of {@link Segmenter},
 * which it reproduces exactly.
 */
final class MultiClassCut {
  private MultiClassCut() {}

  /**
   * The cut of {@code model} on {@code image} ({@code features} its driving channels); the
   * outcome's "mask" holds the class 1..K of every voxel and its flow the energy of that labelling.
   */
  static RefinedCut.Outcome run(
      SegmentationModel model, Raster image, SeedLabels seeds, Raster features) {
    SegmentationSettings settings = model.settings();
    return run(
        features,
        seeds,
        model.likelihood(),
        settings.modelKind(),
        model.roundsWhenApplied(),
        settings.perPlane(),
        Segmenter.energyParameters(model, image));
  }

  static RefinedCut.Outcome run(
      Raster features,
      SeedLabels seeds,
      LikelihoodModel initial,
      ModelKind kind,
      int rounds,
      boolean perPlane,
      EnergyParameters parameters) {
    int classes = initial.classCount();
    PottsEnergy[] kept = new PottsEnergy[1]; // the volume's energy: boundary weights kept
    return RefinedCut.rounds(
        features,
        initial,
        kind,
        rounds,
        costs ->
            perPlane && features.depth() > 1
                ? PlaneCuts.cutEachPlane(
                    features, costs, seeds, (f, c, s) -> expansion(f, c, s, parameters))
                : expansion(
                    seeds,
                    () ->
                        kept[0] =
                            kept[0] == null
                                ? PottsEnergy.build(features, costs, seeds, parameters)
                                : kept[0].withCostsAndSeeds(costs, seeds)),
        classMap -> {
          SeedLabels fromCut = labelsFromClasses(classMap, seeds, perPlane);
          // null when a class lies all in boundary bands: nothing to learn it from
          return everyClassPresent(fromCut, classes) ? fromCut : null;
        });
  }

  /** One expansion run on one graph; the "mask" of the outcome holds class labels 1..K. */
  private static Segmenter.CutOutcome expansion(
      Raster features, float[][] costs, SeedLabels seeds, EnergyParameters parameters) {
    return expansion(seeds, () -> PottsEnergy.build(features, costs, seeds, parameters));
  }

  private static Segmenter.CutOutcome expansion(
      SeedLabels seeds, java.util.function.Supplier<PottsEnergy> energyOf) {
    long start = System.nanoTime();
    PottsEnergy energy = energyOf.get();
    double setupMs = Segmenter.millisSince(start);
    AlphaExpansion.Outcome outcome =
        AlphaExpansion.run(
            energy, AlphaExpansion.backgroundStart(seeds), AlphaExpansion.DEFAULT_MAX_CYCLES);
    return new Segmenter.CutOutcome(
        outcome.labels(), outcome.energy(), setupMs + outcome.buildMs(), outcome.solveMs());
  }

  /**
   * The class map as seed labels for re-learning: each voxel its class, except within {@link
   * RefinedCut#BAND} voxels of a boundary between classes (left unlabelled); seeds keep their own
   * label.
   */
  static SeedLabels labelsFromClasses(byte[] classMap, SeedLabels seeds, boolean perPlane) {
    int w = seeds.width();
    int h = seeds.height();
    int d = seeds.depth();
    byte[] labels = classMap.clone();
    // the union of the bands around every class is the band around the class map's boundaries
    BoundaryBand.clear(labels, classMap, w, h, d, RefinedCut.BAND, perPlane);
    byte[] seedLabels = seeds.labels();
    for (int i = 0; i < labels.length; i++) {
      if (seedLabels[i] != 0) {
        labels[i] = seedLabels[i];
      }
    }
    return new SeedLabels(w, h, d, labels);
  }

  private static boolean everyClassPresent(SeedLabels labels, int classes) {
    long[] counts = labels.countsPerLabel();
    if (counts.length <= classes) {
      return false;
    }
    for (int c = 1; c <= classes; c++) {
      if (counts[c] == 0) {
        return false;
      }
    }
    return true;
  }
}
