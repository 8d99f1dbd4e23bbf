package io.github.cleave.model;

/** Which likelihood model {@link ModelLearner} learns from the seeds. */
public enum ModelKind {
  /** {@link #HISTOGRAM} for a one-channel image, {@link #GAUSSIAN_MIXTURE} for several channels. */
  AUTO,
  /** Smoothed intensity histograms per class ({@link HistogramModel}); one channel only. */
  HISTOGRAM,
  /** Full-covariance Gaussian mixtures per class ({@link GaussianMixtureModel}); any channels. */
  GAUSSIAN_MIXTURE
}
