package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;

import ij.Prefs;
import io.github.cleave.image.VoxelSize;
import java.util.ArrayDeque;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

class ObjectSplittingTest {

  /** Voxels in {@code a} and not in {@code b}. */
  private static long minus(byte[] a, byte[] b) {
    long c = 0;
    for (int i = 0; i < a.length; i++) {
      if (a[i] != 0 && b[i] == 0) {
        c++;
      }
    }
    return c;
  }

  private static byte[] union(byte[] a, byte[] b) {
    byte[] u = a.clone();
    for (int i = 0; i < u.length; i++) {
      u[i] |= b[i];
    }
    return u;
  }

  @Test
  void twoOverlappingDisksBecomeTwoObjectsOfAboutTheirArea() {
    SplittableRandom rnd = new SplittableRandom(31);
    boolean black = Prefs.blackBackground;
    try {
      for (int t = 0; t < 20; t++) {
        Prefs.blackBackground = t % 2 == 0; // the result must not depend on this preference
        double r1 = rnd.nextDouble(10, 20);
        double r2 = rnd.nextDouble(10, 20);
        double gap = (r1 + r2) * rnd.nextDouble(0.7, 0.85); // overlapping a little
        double angle = rnd.nextDouble(0, Math.PI);
        int w = 100;
        int h = 100;
        double x1 = 50 - gap / 2 * Math.cos(angle) + rnd.nextDouble(-2, 2);
        double y1 = 50 - gap / 2 * Math.sin(angle) + rnd.nextDouble(-2, 2);
        double x2 = x1 + gap * Math.cos(angle);
        double y2 = y1 + gap * Math.sin(angle);
        byte[] a = new byte[w * h];
        byte[] b = new byte[w * h];
        Phantoms.disk(a, w, h, 1, 1, x1, y1, r1);
        Phantoms.disk(b, w, h, 1, 1, x2, y2, r2);
        byte[] mask = union(a, b);
        ObjectLabels labels =
            ObjectSplitting.split(
                mask, w, h, 1, VoxelSize.PIXELS, ObjectSplit.DISTANCE_WATERSHED, null);
        assertThat(labels.count()).as("trial %d", t).isEqualTo(2);
        assertThat(
                ObjectSplitting.split(mask, w, h, 1, VoxelSize.PIXELS, ObjectSplit.NONE, null)
                    .count())
            .isEqualTo(1);
        checkHalves(labels, a, b, (int) x1 + w * (int) y1, (int) x2 + w * (int) y2, t);
      }
    } finally {
      Prefs.blackBackground = black;
    }
  }

  /**
   * No voxel lost; each object holds its own disk's centre, and its size lies between the part of
   * its disk outside the other and the whole disk, give or take a 3 % margin for the dividing line
   * (our own tolerance, no source).
   */
  private static void checkHalves(ObjectLabels labels, byte[] a, byte[] b, int ca, int cb, int t) {
    long[] size = labels.voxelCounts();
    assertThat(size[1] + size[2]).isEqualTo(Phantoms.count(union(a, b)));
    int la = labels.labelAt(ca);
    int lb = labels.labelAt(cb);
    assertThat(la).isNotZero().isNotEqualTo(lb);
    assertThat(lb).isNotZero();
    long fullA = Phantoms.count(a);
    long fullB = Phantoms.count(b);
    assertThat(size[la])
        .as("trial %d", t)
        .isBetween((long) (0.97 * minus(a, b)), (long) (1.03 * fullA));
    assertThat(size[lb])
        .as("trial %d", t)
        .isBetween((long) (0.97 * minus(b, a)), (long) (1.03 * fullB));
  }

  @Test
  void singleDiskOrBallIsNotSplit() {
    SplittableRandom rnd = new SplittableRandom(32);
    for (int t = 0; t < 10; t++) {
      int w = 64;
      byte[] disk = new byte[w * w];
      Phantoms.disk(
          disk, w, w, 1, 1, rnd.nextDouble(25, 39), rnd.nextDouble(25, 39), rnd.nextDouble(5, 24));
      assertThat(split(disk, w, w, 1, VoxelSize.PIXELS).count()).isEqualTo(1);
      int d = 16;
      byte[] ball = new byte[w * w * d];
      double r = rnd.nextDouble(8, 15);
      Phantoms.ball(ball, 40, 40, d, 1, 1, 2.5, 20 + rnd.nextDouble(-2, 2), 20, 20, r);
      assertThat(
              split(
                      java.util.Arrays.copyOf(ball, 40 * 40 * d),
                      40,
                      40,
                      d,
                      new VoxelSize(1, 1, 2.5, "um", false))
                  .count())
          .isEqualTo(1);
    }
  }

  private static ObjectLabels split(byte[] mask, int w, int h, int d, VoxelSize vs) {
    return ObjectSplitting.split(mask, w, h, d, vs, ObjectSplit.DISTANCE_WATERSHED, null);
  }

  @Test
  void twoTouchingBallsInAnisotropicStack() {
    SplittableRandom rnd = new SplittableRandom(33);
    for (int t = 0; t < 6; t++) {
      double sz = rnd.nextDouble(2, 3);
      VoxelSize vs = new VoxelSize(1, 1, sz, "um", false);
      double r1 = rnd.nextDouble(8, 12);
      double r2 = rnd.nextDouble(8, 12);
      double gap = (r1 + r2) * rnd.nextDouble(0.7, 0.85);
      // direction in 3D, random
      double theta = rnd.nextDouble(0, Math.PI);
      double phi = rnd.nextDouble(-0.5, 0.5);
      double ux = Math.cos(theta) * Math.cos(phi);
      double uy = Math.sin(theta) * Math.cos(phi);
      double uz = Math.sin(phi);
      int w = 64;
      int h = 64;
      int d = (int) (64 / sz);
      double cx = 32;
      double cy = 32;
      double cz = d * sz / 2;
      double[] p1 = {cx - ux * gap / 2, cy - uy * gap / 2, cz - uz * gap / 2};
      double[] p2 = {cx + ux * gap / 2, cy + uy * gap / 2, cz + uz * gap / 2};
      byte[] a = new byte[w * h * d];
      byte[] b = new byte[w * h * d];
      Phantoms.ball(a, w, h, d, 1, 1, sz, p1[0], p1[1], p1[2], r1);
      Phantoms.ball(b, w, h, d, 1, 1, sz, p2[0], p2[1], p2[2], r2);
      ObjectLabels labels = split(union(a, b), w, h, d, vs);
      assertThat(labels.count()).as("trial %d", t).isEqualTo(2);
      checkHalves(labels, a, b, index(p1, w, h, sz), index(p2, w, h, sz), t);
    }
  }

  private static int index(double[] p, int w, int h, double sz) {
    return (int) p[0] + w * ((int) p[1] + h * (int) (p[2] / sz));
  }

  /** Breadth-first step distances (8/26 neighbours, inside the mask) from a set of voxels. */
  private static int[] steps(byte[] mask, int w, int h, int d, byte[] from) {
    int[] dist = new int[mask.length];
    java.util.Arrays.fill(dist, Integer.MAX_VALUE);
    ArrayDeque<Integer> queue = new ArrayDeque<>();
    for (int i = 0; i < mask.length; i++) {
      if (from[i] != 0) {
        dist[i] = 0;
        queue.add(i);
      }
    }
    while (!queue.isEmpty()) {
      int p = queue.poll();
      int x = p % w;
      int y = (p / w) % h;
      int z = p / (w * h);
      for (int qz = z - 1; qz <= z + 1; qz++) {
        for (int qy = y - 1; qy <= y + 1; qy++) {
          for (int qx = x - 1; qx <= x + 1; qx++) {
            if (qx < 0 || qy < 0 || qz < 0 || qx >= w || qy >= h || qz >= d) {
              continue;
            }
            int q = qx + w * (qy + h * qz);
            if (mask[q] != 0 && dist[q] == Integer.MAX_VALUE) {
              dist[q] = dist[p] + 1;
              queue.add(q);
            }
          }
        }
      }
    }
    return dist;
  }

  @Test
  void perStrokeAssignsEveryVoxelToANearestStroke() {
    SplittableRandom rnd = new SplittableRandom(34);
    for (int t = 0; t < 150; t++) {
      int w = 3 + rnd.nextInt(25);
      int h = 3 + rnd.nextInt(25);
      int d = t % 3 == 0 ? 2 + rnd.nextInt(4) : 1;
      byte[] mask = Phantoms.noise(rnd, w * h * d, rnd.nextDouble(0.4, 0.8));
      byte[] strokes = Phantoms.noise(rnd, w * h * d, rnd.nextDouble(0.0, 0.05));
      ObjectLabels labels =
          ObjectSplitting.split(mask, w, h, d, VoxelSize.PIXELS, ObjectSplit.PER_STROKE, strokes);
      // Stroke pieces inside the mask, numbered independently.
      byte[] inside = new byte[mask.length];
      for (int i = 0; i < mask.length; i++) {
        inside[i] = (byte) (mask[i] != 0 && strokes[i] != 0 ? 1 : 0);
      }
      ObjectLabels pieces = ConnectedComponents.of(inside, w, h, d);
      int[][] dist = new int[pieces.count() + 1][];
      for (int k = 1; k <= pieces.count(); k++) {
        byte[] one = new byte[mask.length];
        for (int i = 0; i < mask.length; i++) {
          one[i] = (byte) (pieces.labelAt(i) == k ? 1 : 0);
        }
        dist[k] = steps(mask, w, h, d, one);
      }
      ObjectLabels components = ConnectedComponents.of(mask, w, h, d);
      // Each stroke piece lies in exactly one object, and objects with a piece have one piece.
      int[] pieceOfObject = new int[labels.count() + 1];
      for (int i = 0; i < mask.length; i++) {
        int k = pieces.labelAt(i);
        if (k != 0) {
          int l = labels.labelAt(i);
          assertThat(pieceOfObject[l] == 0 || pieceOfObject[l] == k).isTrue();
          pieceOfObject[l] = k;
        }
      }
      for (int i = 0; i < mask.length; i++) {
        int l = labels.labelAt(i);
        assertThat(l != 0).isEqualTo(mask[i] != 0);
        if (l == 0) {
          continue;
        }
        int best = Integer.MAX_VALUE;
        for (int k = 1; k <= pieces.count(); k++) {
          best = Math.min(best, dist[k][i]);
        }
        if (best == Integer.MAX_VALUE) {
          // No stroke in this component: the object is exactly the component.
          assertThat(pieceOfObject[l]).isZero();
          assertThat(labels.voxelCounts()[l])
              .isEqualTo(components.voxelCounts()[components.labelAt(i)]);
        } else {
          assertThat(dist[pieceOfObject[l]][i]).as("trial %d voxel %d", t, i).isEqualTo(best);
        }
      }
    }
  }

  @Test
  void perStrokeSplitsTouchingDisksByTheirStrokes() {
    int w = 80;
    byte[] mask = new byte[w * 40];
    Phantoms.disk(mask, w, 40, 1, 1, 25, 20, 15);
    Phantoms.disk(mask, w, 40, 1, 1, 50, 20, 15);
    Phantoms.disk(mask, w, 40, 1, 1, 74, 34, 4); // no stroke: stays its own object
    byte[] strokes = new byte[mask.length];
    for (int x = 18; x < 30; x++) {
      strokes[x + w * 20] = 1;
      strokes[x + 30 + w * 18] = 1;
    }
    ObjectLabels labels =
        ObjectSplitting.split(mask, w, 40, 1, VoxelSize.PIXELS, ObjectSplit.PER_STROKE, strokes);
    assertThat(labels.count()).isEqualTo(3);
    assertThat(labels.label(12, 20, 0)).isNotEqualTo(labels.label(62, 20, 0));
    assertThat(labels.label(74, 34, 0)).isNotIn(labels.label(12, 20, 0), labels.label(62, 20, 0));
  }
}
