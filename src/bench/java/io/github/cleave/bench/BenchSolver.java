package io.github.cleave.bench;

import io.github.cleave.synth.SyntheticGridProblem;

/** A max-flow solver under benchmark: builds the problem and solves it, {@code repeats} times. */
interface BenchSolver {
  String name();

  /** Builds and solves {@code repeats} times from scratch; reports medians. */
  Measurement run(SyntheticGridProblem problem, int repeats);
}
