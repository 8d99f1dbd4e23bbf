package io.github.cleave.energy;

import io.github.cleave.flow.SolveStatus;
import io.github.cleave.image.SeedLabels;
import java.util.Arrays;
import java.util.Locale;
import java.util.concurrent.CancellationException;

/**
 * Minimises a K-class {@link PottsEnergy} by alpha-expansion moves until a full cycle over the
 * classes lowers the energy no more (Y. Boykov, O. Veksler and R. Zabih, "Fast approximate energy
 * minimization via graph cuts", IEEE TPAMI 23(11):1222–1239, 2001, doi:10.1109/34.969114).
 *
 * <h2>Method</h2>
 *
 * Classes α = 1, 2, ..., K are visited in turn, cycle after cycle. Each move lets any set of voxels
 * switch to α at once and finds the best such set by one minimum cut ({@code ExpansionMove}); the
 * move is accepted only if it lowers the energy strictly. The run stops when no move can lower the
 * energy any more: K moves in a row (one per class) refused, or K − 1 refused after an accepted one
 * (repeating the accepted class could not help: its move already took the best of every labelling a
 * repeat could reach), or after {@code maxCycles} cycles.
 *
 * <h2>Guarantees</h2>
 *
 * <ul>
 *   <li>The energy never rises; every accepted move's energy is certified by its flow value (energy
 *       = flow value + a constant of the move, checked under {@code assert}).
 *   <li>Seeds keep their class throughout: a start labelling that breaks a seed is refused, and a
 *       move never moves a seed of another class to α.
 *   <li>At convergence no single expansion move lowers the energy, and for the Potts boundary term
 *       the energy is at most twice the global minimum (BVZ 2001, Theorem 6.1, with all terms ≥ 0).
 *   <li>With K = 2 the local minimum is a global one (the energy is submodular; the two moves reach
 *       the union and the intersection with any optimum), i.e. a minimum cut of {@link CutProblem},
 *       though not necessarily its minimal source set when minimum cuts tie.
 * </ul>
 *
 * <h2>Cost</h2>
 *
 * Each move builds a new grid solver, O(n · K_nb) plus its solve; a run is at most {@code maxCycles
 * · K} moves, in practice two to four cycles. Memory: one grid solver at a time (with its
 * capacities kept when assertions are on), two int arrays of n for its terminals, and a few
 * labellings of n bytes, besides the energy itself.
 *
 * <p>Interruption: the thread's interrupt flag is checked before every move and inside every solve;
 * it ends the run with {@link CancellationException}, the flag left set. Stateless and thread-safe
 * (one run per thread).
 */
public final class AlphaExpansion {
  private AlphaExpansion() {}

  /**
   * The result of a run.
   *
   * @param labels the final labelling, {@code labels[p]} in 1..K as unsigned bytes
   * @param energy its exact energy in capacity units
   * @param cycles cycles begun over the classes
   * @param moves moves solved (accepted or not)
   * @param energyAfterMove {@code energyAfterMove[i]}: the energy kept after move i (the previous
   *     value when the move was refused); non-increasing, {@code moves} entries
   * @param buildMs total time building the moves' graphs
   * @param solveMs total time solving them
   */
  public record Outcome(
      byte[] labels,
      long energy,
      int cycles,
      int moves,
      long[] energyAfterMove,
      double buildMs,
      double solveMs) {}

  /**
   * Cycles over the classes allowed per run by the pipeline and the seed brush alike. Expansion
   * usually settles in two or three (BVZ 2001 report that most of the decrease comes in the first
   * cycle); common practice, no source for the exact cap.
   */
  public static final int DEFAULT_MAX_CYCLES = 6;

  /**
   * The start the pipeline and the seed brush use: the background everywhere, seeds their own
   * class. With two classes the first move (class 1) is then the two-class minimum cut itself, with
   * its choice among equal cuts (the smallest foreground), and no later move can lower its energy.
   */
  public static byte[] backgroundStart(SeedLabels seeds) {
    byte[] start = seeds.labels().clone();
    for (int i = 0; i < start.length; i++) {
      if (start[i] == 0) {
        start[i] = SeedLabels.BACKGROUND;
      }
    }
    return start;
  }

  /**
   * Runs alpha-expansion from {@code start}.
   *
   * @param energy the energy to minimise
   * @param start the start labelling (copied): labels 1..K, every seed holding its class, e.g.
   *     {@link PottsEnergy#cheapestLabels()}
   * @param maxCycles the largest number of cycles over the classes, at least 1
   * @throws IllegalArgumentException if {@code start} is not a labelling of the energy, breaks a
   *     seed, or {@code maxCycles} is below 1
   * @throws CancellationException if the thread is interrupted
   */
  public static Outcome run(PottsEnergy energy, byte[] start, int maxCycles) {
    if (maxCycles < 1) {
      throw new IllegalArgumentException(
          String.format(Locale.ROOT, "alpha-expansion: %d cycles; give 1 or more", maxCycles));
    }
    byte[] labels = start.clone();
    long current = energy.energy(labels); // checks the labels
    if (current == Long.MAX_VALUE) {
      throw new IllegalArgumentException(
          "alpha-expansion: the start labelling changes a seed's class; set every seed voxel to"
              + " its seed label (cheapestLabels() does)");
    }
    int classes = energy.classCount();
    long[] history = new long[Math.min(maxCycles, 8) * classes];
    int moves = 0;
    int cycles = 0;
    int refusedInARow = 0;
    boolean accepted = false;
    int[][] terminals = new int[2][labels.length]; // the moves' terminal capacities, reused
    double buildMs = 0;
    double solveMs = 0;
    run:
    for (int cycle = 0; cycle < maxCycles; cycle++) {
      cycles++;
      for (int alpha = 1; alpha <= classes; alpha++) {
        if (Thread.currentThread().isInterrupted()) {
          throw new CancellationException("alpha-expansion interrupted");
        }
        ExpansionMove.Result move =
            ExpansionMove.solve(energy, labels, alpha, terminals[0], terminals[1]);
        if (move.status() == SolveStatus.INTERRUPTED) {
          throw new CancellationException("alpha-expansion interrupted");
        }
        assert move.energy() == energy.energy(move.labels()) : "move energy not certified";
        buildMs += move.buildMs();
        solveMs += move.solveMs();
        if (move.energy() < current) {
          labels = move.labels();
          current = move.energy();
          refusedInARow = 0;
          accepted = true;
        } else {
          refusedInARow++;
        }
        if (moves == history.length) {
          history = Arrays.copyOf(history, 2 * history.length);
        }
        history[moves++] = current;
        // After an accepted move of class a, a repeat of a cannot help: every labelling it
        // reaches, the accepted move could reach too, and it took the best of them. So K - 1
        // refusals after an acceptance (K before any) mean no move lowers the energy.
        if (refusedInARow >= (accepted ? classes - 1 : classes)) {
          break run;
        }
      }
    }
    return new Outcome(
        labels, current, cycles, moves, Arrays.copyOf(history, moves), buildMs, solveMs);
  }
}
