package io.github.cleave.energy;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.flow.Neighborhood;
import io.github.cleave.flow.SolveStatus;
import java.util.SplittableRandom;
import java.util.concurrent.CancellationException;
import org.junit.jupiter.api.Test;

/**
 * Every move of alpha-expansion is certified by its flow: the move's flow value plus its constant
 * is exactly the energy of the labelling it gives (max-flow min-cut theorem, Ford and Fulkerson,
 * Canadian J. Math. 8, 1956, with the pair terms represented as in Kolmogorov and Zabih, IEEE TPAMI
 * 26(2), 2004), which never exceeds the energy before it (keeping every label is one of the cuts).
 * Runs over 2D and 3D neighbourhoods with two to six classes; seeds keep their class throughout.
 */
class AlphaExpansionMovesTest {
  private static final Neighborhood[] PLANE = {Neighborhood.N4, Neighborhood.N8, Neighborhood.N16};
  private static final Neighborhood[] STACK = {Neighborhood.N6, Neighborhood.N18, Neighborhood.N26};

  @Test
  void everyMoveIsCertifiedAndNeverRaisesTheEnergy() {
    SplittableRandom random = new SplittableRandom(1222L);
    for (int trial = 0; trial < 80; trial++) {
      PottsCases.Case c = randomCase(random, trial);
      PottsEnergy energy = c.energy();
      long[][] pairs = PottsCases.pairs(c);
      int classes = energy.classCount();
      byte[] labels =
          random.nextBoolean()
              ? energy.cheapestLabels()
              : PottsCases.randomLabels(random, c, classes);
      long current = energy.energy(labels);
      for (int cycle = 0; cycle < 2; cycle++) {
        for (int alpha = 1; alpha <= classes; alpha++) {
          ExpansionMove.Result move = ExpansionMove.solve(energy, labels, alpha);
          assertThat(move.status()).isEqualTo(SolveStatus.OPTIMAL);
          long reached = PottsCases.energy(c, pairs, move.labels());
          assertThat(move.flowValue() + move.constant()).isEqualTo(reached);
          assertThat(move.energy()).isEqualTo(reached).isLessThanOrEqualTo(current);
          assertSeedsKept(c, move.labels());
          for (int p = 0; p < labels.length; p++) { // a voxel keeps its label or takes alpha
            assertThat(move.labels()[p]).isIn(labels[p], (byte) alpha);
          }
          labels = move.labels();
          current = reached;
        }
      }
    }
  }

  @Test
  void runsAreNonIncreasingKeepSeedsAndEndInAnExpansionLocalMinimum() {
    SplittableRandom random = new SplittableRandom(23L);
    for (int trial = 0; trial < 60; trial++) {
      PottsCases.Case c = randomCase(random, trial);
      PottsEnergy energy = c.energy();
      long[][] pairs = PottsCases.pairs(c);
      byte[] start = energy.cheapestLabels();
      byte[] copy = start.clone();
      AlphaExpansion.Outcome outcome = AlphaExpansion.run(energy, start, 50);
      assertThat(start).isEqualTo(copy);
      long[] history = outcome.energyAfterMove();
      assertThat(history).hasSize(outcome.moves());
      assertThat(outcome.moves())
          .isGreaterThanOrEqualTo(energy.classCount())
          .isLessThanOrEqualTo(outcome.cycles() * energy.classCount());
      long previous = energy.energy(start);
      for (long e : history) {
        assertThat(e).isLessThanOrEqualTo(previous);
        previous = e;
      }
      assertThat(outcome.energy())
          .isEqualTo(history[history.length - 1])
          .isEqualTo(PottsCases.energy(c, pairs, outcome.labels()));
      assertSeedsKept(c, outcome.labels());
      for (int alpha = 1; alpha <= energy.classCount(); alpha++) {
        assertThat(ExpansionMove.solve(energy, outcome.labels(), alpha).energy())
            .isGreaterThanOrEqualTo(outcome.energy());
      }
    }
  }

  @Test
  void aCycleLimitStopsEarlyWithTheEnergySoFar() {
    SplittableRandom random = new SplittableRandom(4L);
    PottsCases.Case c = PottsCases.random(random, 30, 20, 1, Neighborhood.N8, 4, 0.02);
    PottsEnergy energy = c.energy();
    AlphaExpansion.Outcome outcome =
        AlphaExpansion.run(energy, PottsCases.randomLabels(random, c, 4), 1);
    assertThat(outcome.cycles()).isEqualTo(1);
    assertThat(outcome.moves()).isEqualTo(4);
    assertThat(outcome.energy()).isEqualTo(energy.energy(outcome.labels()));
  }

  @Test
  void interruptionThrowsCancellation() {
    SplittableRandom random = new SplittableRandom(9L);
    PottsCases.Case c = PottsCases.random(random, 12, 10, 1, Neighborhood.N4, 3, 0.05);
    PottsEnergy energy = c.energy();
    Thread.currentThread().interrupt();
    try {
      assertThatThrownBy(() -> AlphaExpansion.run(energy, energy.cheapestLabels(), 5))
          .isInstanceOf(CancellationException.class);
      assertThat(Thread.currentThread().isInterrupted()).isTrue();
    } finally {
      Thread.interrupted();
    }
  }

  @Test
  void refusesAStartThatBreaksASeedOrBadArguments() {
    SplittableRandom random = new SplittableRandom(10L);
    PottsCases.Case c = PottsCases.random(random, 6, 6, 1, Neighborhood.N4, 3, 0.3);
    PottsEnergy energy = c.energy();
    byte[] start = energy.cheapestLabels();
    int seeded = 0;
    while (c.seeds().label(seeded) == 0) {
      seeded++;
    }
    start[seeded] = (byte) (1 + c.seeds().label(seeded) % 3);
    assertThatThrownBy(() -> AlphaExpansion.run(energy, start, 5))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("seed");
    assertThatThrownBy(() -> AlphaExpansion.run(energy, energy.cheapestLabels(), 0))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("0 cycles");
    assertThatThrownBy(() -> AlphaExpansion.run(energy, new byte[36], 5))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("label 0 at voxel 0");
  }

  private static PottsCases.Case randomCase(SplittableRandom random, int trial) {
    int classes = 2 + random.nextInt(5);
    double seedShare = random.nextDouble() * 0.2;
    PottsCases.Case c =
        trial % 3 == 0
            ? PottsCases.random(
                random,
                3 + random.nextInt(6),
                3 + random.nextInt(6),
                2 + random.nextInt(4),
                STACK[random.nextInt(3)],
                classes,
                seedShare)
            : PottsCases.random(
                random,
                4 + random.nextInt(20),
                4 + random.nextInt(20),
                1,
                PLANE[random.nextInt(3)],
                classes,
                seedShare);
    if (random.nextInt(3) == 0) { // strong boundaries: long moves, many refused
      EnergyParameters p = c.parameters();
      c =
          new PottsCases.Case(
              c.image(),
              c.costs(),
              c.seeds(),
              new EnergyParameters(
                  10 + 30 * random.nextDouble(),
                  p.contrastScale() * 3,
                  p.neighborhood(),
                  p.voxelSize()));
    }
    return c;
  }

  private static void assertSeedsKept(PottsCases.Case c, byte[] labels) {
    for (int p = 0; p < labels.length; p++) {
      int seed = c.seeds().label(p);
      if (seed != 0) {
        assertThat(labels[p] & 0xff).isEqualTo(seed);
      }
    }
  }
}
