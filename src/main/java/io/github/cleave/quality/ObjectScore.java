package io.github.cleave.quality;

/**
 * Object-level detection counts and scores, from {@link Agreement#objects}. Precision, recall and
 * F1 are 1 when their denominator is 0 (nothing to find and nothing found); common practice, no
 * source. Immutable.
 *
 * @param truePositives objects matched one to one
 * @param falsePositives found objects without a match
 * @param falseNegatives reference objects without a match
 */
public record ObjectScore(int truePositives, int falsePositives, int falseNegatives) {

  /** Matched over found objects. */
  public double precision() {
    int found = truePositives + falsePositives;
    return found == 0 ? 1.0 : (double) truePositives / found;
  }

  /** Matched over reference objects. */
  public double recall() {
    int reference = truePositives + falseNegatives;
    return reference == 0 ? 1.0 : (double) truePositives / reference;
  }

  /** Harmonic mean of precision and recall: 2 TP / (2 TP + FP + FN). */
  public double f1() {
    int denominator = 2 * truePositives + falsePositives + falseNegatives;
    return denominator == 0 ? 1.0 : 2.0 * truePositives / denominator;
  }
}
