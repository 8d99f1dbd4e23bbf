package io.github.cleave.flow;

/**
 * Thrown by {@code checkCertificate()} when a solver's flow or cut fails its proof of optimality: a
 * capacity bound or conservation is broken, the sink is reachable in the residual graph, or the cut
 * capacity differs from the flow value. This is always a bug in the solver.
 */
public final class CertificateViolation extends IllegalStateException {
  private static final long serialVersionUID = 1L;

  /** A violation described by {@code message}, which names the node or arc and the values. */
  public CertificateViolation(String message) {
    super(message);
  }
}
