package io.github.cleave.batch;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.BadInputException;
import java.util.SplittableRandom;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicLong;
import org.junit.jupiter.api.Test;

/** The heap budget: never over-committed, an image beyond it refused with its need. */
class MemoryBudgetTest {

  @Test
  void anImageLargerThanTheWholeBudgetIsRefusedWithWhatItNeeds() {
    MemoryBudget b = new MemoryBudget(100L << 20);
    assertThatThrownBy(() -> b.reserve(300L << 20, "big.tif"))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("big.tif")
        .hasMessageContaining("300 MiB")
        .hasMessageContaining("-Xmx");
  }

  @Test
  void parallelReservationsNeverExceedTheBudget() throws Exception {
    long total = 1000;
    MemoryBudget b = new MemoryBudget(total);
    AtomicLong inUse = new AtomicLong();
    AtomicLong worst = new AtomicLong();
    int threads = 4;
    CountDownLatch finished = new CountDownLatch(threads);
    for (int t = 0; t < threads; t++) {
      SplittableRandom random = new SplittableRandom(t);
      Thread worker =
          new Thread(
              () -> {
                try {
                  for (int i = 0; i < 300; i++) {
                    long want = 1 + random.nextInt((int) total);
                    long got = b.reserve(want, "f");
                    worst.accumulateAndGet(inUse.addAndGet(got), Math::max);
                    inUse.addAndGet(-got);
                    b.release(got);
                  }
                } catch (InterruptedException e) {
                  Thread.currentThread().interrupt();
                } finally {
                  finished.countDown();
                }
              });
      worker.start();
    }
    assertThat(finished.await(60, TimeUnit.SECONDS)).isTrue();
    assertThat(worst.get()).isBetween(1L, total);
    assertThat(b.reserve(total, "f")).isEqualTo(total); // everything was given back
    assertThat(b.reserve(-1, "unknown size")).isZero();
  }
}
