package io.github.cleave.objects;

import static org.assertj.core.api.Assertions.assertThat;

import io.github.cleave.image.VoxelSize;
import io.github.cleave.objects.reference.RandomMasks;
import io.github.cleave.objects.reference.RefObjectPipeline;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/**
 * The stack watershed on foreground voxels only gives exactly what its whole-grid reference (test
 * scope, {@link RefObjectPipeline}) gives, step by step (distance map float for float, markers,
 * labels) and with both neighbour layouts, over seeded random stacks of touching shapes; enough of
 * them are really split (more objects than connected components) for the flood to be exercised.
 */
class StackWatershedCrossCheckTest {

  private static int[] dims(SplittableRandom rnd) {
    return switch (rnd.nextInt(4)) {
      case 0 -> new int[] {rnd.nextInt(1, 5), rnd.nextInt(1, 14), rnd.nextInt(2, 7)}; // thin
      case 1 -> new int[] {rnd.nextInt(4, 30), rnd.nextInt(4, 30), 1}; // a plane
      default -> new int[] {rnd.nextInt(12, 56), rnd.nextInt(12, 56), rnd.nextInt(3, 18)};
    };
  }

  /** The values of slots scattered to a whole-grid array (0 elsewhere). */
  private static int[] wholeGrid(ForegroundRuns runs, int[] bySlot) {
    int[] out = new int[runs.w * runs.h * runs.d];
    for (int r = 0, s = 0; r < runs.count; r++) {
      for (int x = runs.start[r]; x <= runs.end[r]; x++) {
        out[runs.row[r] * runs.w + x] = bySlot[s++];
      }
    }
    return out;
  }

  @Test
  void distanceMapIsTheReferenceFloatForFloat() {
    SplittableRandom rnd = new SplittableRandom(20261203L);
    for (int t = 0; t < 300; t++) {
      int[] s = dims(rnd);
      byte[] mask = RandomMasks.mask(rnd, s[0], s[1], s[2]);
      VoxelSize vs = RandomMasks.voxelSize(rnd);
      float[] expected = RefObjectPipeline.distance(mask, s[0], s[1], s[2], vs.x(), vs.y(), vs.z());
      float[] actual = DistanceMapTest.wholeGrid(mask, s[0], s[1], s[2], vs.x(), vs.y(), vs.z());
      assertThat(actual).as("trial %d, %s, %s", t, Arrays.toString(s), vs).isEqualTo(expected);
    }
  }

  @Test
  void bothNeighbourLayoutsListTheGridNeighboursInGridOrder() {
    SplittableRandom rnd = new SplittableRandom(5);
    for (int t = 0; t < 150; t++) {
      int[] s = dims(rnd);
      int w = s[0];
      int h = s[1];
      int d = s[2];
      byte[] mask = RandomMasks.mask(rnd, w, h, d);
      ForegroundRuns runs = ForegroundRuns.of(mask, null, w, h, d);
      ForegroundNeighbours table = ForegroundNeighbours.of(runs, true);
      ForegroundNeighbours map = ForegroundNeighbours.of(runs, false);
      int[] voxel = new int[table.size];
      int[] slotOf = new int[mask.length];
      Arrays.fill(slotOf, -1);
      for (int r = 0, k = 0; r < runs.count; r++) {
        for (int x = runs.start[r]; x <= runs.end[r]; x++, k++) {
          voxel[k] = runs.row[r] * w + x;
          slotOf[voxel[k]] = k;
        }
      }
      Grids grid = new Grids(w, h, d, true);
      for (int k = 0; k < table.size; k++) {
        List<Integer> expected = new ArrayList<>();
        int m = grid.neighbours(voxel[k]);
        for (int j = 0; j < m; j++) {
          if (mask[grid.buffer[j]] != 0) {
            expected.add(slotOf[grid.buffer[j]]);
          }
        }
        assertThat(listed(table, k)).as("table, trial %d slot %d", t, k).isEqualTo(expected);
        assertThat(listed(map, k)).as("map, trial %d slot %d", t, k).isEqualTo(expected);
      }
    }
  }

  private static List<Integer> listed(ForegroundNeighbours g, int s) {
    List<Integer> out = new ArrayList<>();
    for (int e = g.at(s), end = e + g.k; e < end; e++) {
      if (g.entries[e] >= 0) {
        out.add(g.entries[e]);
      }
    }
    return out;
  }

  @Test
  void markersAreTheReferenceMarkers() {
    SplittableRandom rnd = new SplittableRandom(11);
    for (int t = 0; t < 300; t++) {
      int[] s = dims(rnd);
      int w = s[0];
      int h = s[1];
      int d = s[2];
      byte[] mask = RandomMasks.mask(rnd, w, h, d);
      VoxelSize vs = RandomMasks.voxelSize(rnd);
      // coarse tolerances make wide plateaus and ties; the watershed's own is half a voxel side
      float tolerance = rnd.nextBoolean() ? (float) (0.5 * vs.x()) : rnd.nextInt(0, 4) * 0.5f;
      tolerance = tolerance > 0 ? tolerance : 0.25f;
      float[] refDist = RefObjectPipeline.distance(mask, w, h, d, vs.x(), vs.y(), vs.z());
      int[] expected = RefObjectPipeline.markers(refDist, w, h, d, tolerance);
      ForegroundRuns runs = ForegroundRuns.of(mask, null, w, h, d);
      ForegroundNeighbours grid = ForegroundNeighbours.of(runs, rnd.nextBoolean());
      float[] dist = DistanceMap.distance(runs, grid.slots, vs.x(), vs.y(), vs.z());
      int[] actual = wholeGrid(runs, DistanceMarkers.markers(dist, grid, tolerance));
      assertThat(actual)
          .as("trial %d, %s, h = %s", t, Arrays.toString(s), tolerance)
          .isEqualTo(expected);
    }
  }

  @Test
  void stackSplitIsTheReferenceSplitWithBothLayoutsAndSplitsTouchingShapes() {
    SplittableRandom rnd = new SplittableRandom(20261202L);
    int split = 0;
    int trials = 240;
    for (int t = 0; t < trials; t++) {
      int w = rnd.nextInt(16, 60);
      int h = rnd.nextInt(16, 60);
      int d = rnd.nextInt(3, 20);
      byte[] mask = RandomMasks.mask(rnd, w, h, d);
      VoxelSize vs = RandomMasks.voxelSize(rnd);
      int[] expected =
          RefObjectPipeline.split(mask, w, h, d, vs, ObjectSplit.DISTANCE_WATERSHED, null);
      for (Boolean layout : new Boolean[] {null, true, false}) {
        ObjectLabels actual =
            DistanceWatershed.splitStack(mask, w, h, d, vs.x(), vs.y(), vs.z(), layout);
        assertThat(actual.labels())
            .as("trial %d, %d x %d x %d, %s, layout %s", t, w, h, d, vs, layout)
            .isEqualTo(expected);
      }
      if (Arrays.stream(expected).max().orElse(0) > ConnectedComponents.of(mask, w, h, d).count()) {
        split++;
      }
    }
    assertThat(split).as("cases with touching shapes split apart").isGreaterThan(trials / 4);
  }

  @Test
  void floodQueuePopsByPriorityThenArrivalOverTheWholeFloatRange() {
    SplittableRandom rnd = new SplittableRandom(12);
    float[] pool = {
      Float.NEGATIVE_INFINITY,
      -3.5f,
      -Float.MIN_VALUE,
      -0.0f,
      0.0f,
      Float.MIN_VALUE,
      1,
      1.5f,
      Float.MAX_VALUE,
      Float.POSITIVE_INFINITY
    };
    for (int t = 0; t < 50; t++) {
      FloodQueue q = new FloodQueue(rnd.nextInt(1, 8));
      List<float[]> pushed = new ArrayList<>(); // {priority, voxel, arrival}
      List<float[]> popped = new ArrayList<>();
      int arrival = 0;
      for (int step = 0; step < 400; step++) {
        if (rnd.nextInt(3) > 0 || q.isEmpty()) {
          float p = rnd.nextBoolean() ? pool[rnd.nextInt(pool.length)] : rnd.nextInt(-5, 5);
          q.push(step, p);
          pushed.add(new float[] {p, step, arrival++});
        } else {
          float top = q.topPriority();
          int v = q.pop();
          float[] best = null;
          for (float[] e : pushed) { // the first arrival among the highest priorities
            if (best == null || e[0] > best[0] || (e[0] == best[0] && e[2] < best[2])) {
              best = e;
            }
          }
          pushed.remove(best);
          assertThat(v).as("trial %d step %d", t, step).isEqualTo((int) best[1]);
          assertThat(top == best[0]).isTrue(); // -0 and +0 are one priority
          popped.add(best);
        }
      }
      assertThat(popped).isNotEmpty();
    }
  }
}
