package io.github.cleave.quality;

import java.util.HashMap;
import java.util.Locale;
import java.util.Map;

/**
 * Agreement between a segmentation and a reference, pixel-wise and object-wise.
 *
 * <ul>
 *   <li>Dice coefficient (L. R. Dice, "Measures of the amount of ecologic association between
 *       species", Ecology 26(3):297–302, 1945): D = 2|A∩B| / (|A| + |B|).
 *   <li>Jaccard index (P. Jaccard, "The distribution of the flora in the alpine zone", New
 *       Phytologist 11(2):37–50, 1912): J = |A∩B| / |A∪B| = D / (2 − D).
 *   <li>Object-level detection scores: objects of two label images are matched one to one when
 *       their intersection over union is at least {@link #MATCH_IOU}; precision = matched / found
 *       objects, recall = matched / reference objects, F1 their harmonic mean. With IoU strictly
 *       above 0.5 an object can overlap at most one other object that much (two disjoint partners
 *       would each need more than half of its pixels), so the matching is unique; at exactly 0.5 a
 *       tie is possible and is broken by taking the larger IoU, then the smaller label.
 * </ul>
 *
 * Masks count every nonzero byte as foreground. When both masks are empty, Dice and Jaccard are 1
 * (perfect agreement on "nothing"); common practice, no source. O(N), plus O(N) hashing for object
 * scores. Stateless, thread-safe.
 */
public final class Agreement {
  /** Smallest intersection over union at which two objects count as the same object. */
  public static final double MATCH_IOU = 0.5;

  private Agreement() {}

  /**
   * Dice coefficient of two masks of equal length; 1 when both are empty.
   *
   * @throws IllegalArgumentException if the lengths differ
   */
  public static double dice(byte[] a, byte[] b) {
    long[] c = counts(a, b);
    long sizes = c[0] + c[1];
    return sizes == 0 ? 1.0 : 2.0 * c[2] / sizes;
  }

  /**
   * Jaccard index of two masks of equal length; 1 when both are empty.
   *
   * @throws IllegalArgumentException if the lengths differ
   */
  public static double jaccard(byte[] a, byte[] b) {
    long[] c = counts(a, b);
    long union = c[0] + c[1] - c[2];
    return union == 0 ? 1.0 : (double) c[2] / union;
  }

  /** {|A|, |B|, |A∩B|}. */
  private static long[] counts(byte[] a, byte[] b) {
    if (a.length != b.length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "masks of %d and %d values: compare masks of one image",
              a.length,
              b.length));
    }
    long na = 0;
    long nb = 0;
    long both = 0;
    for (int i = 0; i < a.length; i++) {
      boolean x = a[i] != 0;
      boolean y = b[i] != 0;
      na += x ? 1 : 0;
      nb += y ? 1 : 0;
      both += x && y ? 1 : 0;
    }
    return new long[] {na, nb, both};
  }

  /**
   * Object-level precision, recall and F1 of {@code found} against {@code reference}: label images
   * of equal length, 0 background, any positive values as object labels (they need not be
   * consecutive; negative values are not allowed).
   *
   * @throws IllegalArgumentException if the lengths differ or a label is negative
   */
  public static ObjectScore objects(int[] reference, int[] found) {
    if (reference.length != found.length) {
      throw new IllegalArgumentException(
          String.format(
              Locale.ROOT,
              "label images of %d and %d values: compare labels of one image",
              reference.length,
              found.length));
    }
    Map<Integer, Long> refSize = new HashMap<>();
    Map<Integer, Long> foundSize = new HashMap<>();
    Map<Long, Long> overlap = new HashMap<>(); // (ref << 32 | found) -> pixels in both
    for (int i = 0; i < reference.length; i++) {
      int r = reference[i];
      int f = found[i];
      if (r < 0 || f < 0) {
        throw new IllegalArgumentException(
            "label " + Math.min(r, f) + " at index " + i + ": labels must be 0 or positive");
      }
      if (r > 0) {
        refSize.merge(r, 1L, Long::sum);
      }
      if (f > 0) {
        foundSize.merge(f, 1L, Long::sum);
      }
      if (r > 0 && f > 0) {
        overlap.merge(((long) r << 32) | f, 1L, Long::sum);
      }
    }
    // best partner per reference object and per found object; a pair is matched when each is the
    // other's best and IoU >= MATCH_IOU (for IoU > 0.5 the partner is the only candidate)
    Map<Integer, long[]> bestForRef = new HashMap<>(); // ref -> {found, inter}
    Map<Integer, long[]> bestForFound = new HashMap<>();
    Map<Integer, Double> bestIouRef = new HashMap<>();
    Map<Integer, Double> bestIouFound = new HashMap<>();
    for (Map.Entry<Long, Long> e : overlap.entrySet()) {
      int r = (int) (e.getKey() >>> 32);
      int f = (int) (e.getKey() & 0xffffffffL);
      long inter = e.getValue();
      double iou = (double) inter / (refSize.get(r) + foundSize.get(f) - inter);
      if (iou < MATCH_IOU) {
        continue;
      }
      if (better(iou, f, bestIouRef.get(r), bestForRef.get(r))) {
        bestIouRef.put(r, iou);
        bestForRef.put(r, new long[] {f, inter});
      }
      if (better(iou, r, bestIouFound.get(f), bestForFound.get(f))) {
        bestIouFound.put(f, iou);
        bestForFound.put(f, new long[] {r, inter});
      }
    }
    int matched = 0;
    for (Map.Entry<Integer, long[]> e : bestForRef.entrySet()) {
      long[] partner = bestForFound.get((int) e.getValue()[0]);
      if (partner != null && partner[0] == e.getKey()) {
        matched++;
      }
    }
    return new ObjectScore(matched, foundSize.size() - matched, refSize.size() - matched);
  }

  private static boolean better(double iou, int label, Double bestIou, long[] best) {
    if (bestIou == null) {
      return true;
    }
    return iou > bestIou || (iou == bestIou && label < best[0]);
  }
}
