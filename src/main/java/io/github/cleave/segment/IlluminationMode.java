package io.github.cleave.segment;

/** Whether uneven illumination is flattened before the likelihoods are learned. */
public enum IlluminationMode {
  /** Flatten when the image shows a strong gradient (see {@link Illumination#isStrongGradient}). */
  AUTO,
  /** Always flatten. */
  ON,
  /** Never flatten. */
  OFF
}
