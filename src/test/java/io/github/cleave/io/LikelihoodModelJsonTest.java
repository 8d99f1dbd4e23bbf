package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.google.gson.Gson;
import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.VoxelSize;
import io.github.cleave.model.GaussianMixture;
import io.github.cleave.model.GaussianMixtureModel;
import io.github.cleave.model.HistogramModel;
import io.github.cleave.model.LikelihoodModel;
import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import java.util.function.Consumer;
import org.junit.jupiter.api.Test;

class LikelihoodModelJsonTest {

  private static HistogramModel randomHistogram(SplittableRandom rng) {
    int classes = 2 + rng.nextInt(3);
    int bins = 1 + rng.nextInt(300);
    double[][] p = new double[classes][bins];
    for (double[] row : p) {
      double sum = 0;
      for (int b = 0; b < bins; b++) {
        row[b] = rng.nextDouble() + 1e-9;
        sum += row[b];
      }
      for (int b = 0; b < bins; b++) {
        row[b] /= sum;
      }
    }
    double low = rng.nextGaussian() * 1e4;
    return HistogramModel.of(low, low + rng.nextDouble() * 1e5 + 1e-3, p);
  }

  private static GaussianMixtureModel randomMixtureModel(SplittableRandom rng) {
    int d = 1 + rng.nextInt(4);
    List<GaussianMixture> mixtures = new ArrayList<>();
    for (int c = 2 + rng.nextInt(2); c > 0; c--) {
      int k = 1 + rng.nextInt(5);
      double[] w = new double[k];
      double sum = 0;
      double[][] mu = new double[k][d];
      double[][][] cov = new double[k][d][d];
      for (int j = 0; j < k; j++) {
        w[j] = rng.nextDouble() + 0.01;
        sum += w[j];
        double[][] a = new double[d][d];
        for (int i = 0; i < d; i++) {
          mu[j][i] = rng.nextGaussian() * 100;
          for (int m = 0; m < d; m++) {
            a[i][m] = rng.nextGaussian() * 7;
          }
        }
        for (int i = 0; i < d; i++) {
          for (int m = 0; m < d; m++) {
            double s = i == m ? 0.3 : 0;
            for (int t = 0; t < d; t++) {
              s += a[i][t] * a[m][t];
            }
            cov[j][i][m] = s;
          }
        }
        for (int i = 0; i < d; i++) {
          for (int m = 0; m < i; m++) {
            cov[j][m][i] = cov[j][i][m];
          }
        }
      }
      for (int j = 0; j < k; j++) {
        w[j] /= sum;
      }
      mixtures.add(GaussianMixture.of(w, mu, cov));
    }
    return GaussianMixtureModel.of(mixtures);
  }

  /** Through text and back, as a model file does. */
  private static LikelihoodModel roundTrip(LikelihoodModel m) {
    String text = new Gson().toJson(LikelihoodModelJson.toJson(m));
    return LikelihoodModelJson.fromJson(JsonParser.parseString(text).getAsJsonObject());
  }

  private static float[][] costsOnRandomPixels(LikelihoodModel m, SplittableRandom rng) {
    int n = 500;
    float[][] ch = new float[m.channelCount()][n];
    for (float[] c : ch) {
      for (int i = 0; i < n; i++) {
        c[i] = (float) (rng.nextGaussian() * 1e4);
      }
    }
    float[][] out = new float[m.classCount()][n];
    m.costs(new Raster(n, 1, 1, ch, VoxelSize.PIXELS, PixelKind.FLOAT32), out);
    return out;
  }

  @Test
  void histogramRoundTripIsExact() {
    SplittableRandom rng = new SplittableRandom(31);
    for (int trial = 0; trial < 50; trial++) {
      HistogramModel m = randomHistogram(rng);
      HistogramModel back = (HistogramModel) roundTrip(m);
      assertThat(back.low()).isEqualTo(m.low());
      assertThat(back.high()).isEqualTo(m.high());
      assertThat(back.binCount()).isEqualTo(m.binCount());
      for (int c = 0; c < m.classCount(); c++) {
        assertThat(back.probabilities(c)).isEqualTo(m.probabilities(c));
      }
      long seed = rng.nextLong();
      assertThat(costsOnRandomPixels(back, new SplittableRandom(seed)))
          .isDeepEqualTo(costsOnRandomPixels(m, new SplittableRandom(seed)));
    }
  }

  @Test
  void mixtureRoundTripIsExact() {
    SplittableRandom rng = new SplittableRandom(37);
    for (int trial = 0; trial < 50; trial++) {
      GaussianMixtureModel m = randomMixtureModel(rng);
      GaussianMixtureModel back = (GaussianMixtureModel) roundTrip(m);
      assertThat(back.classCount()).isEqualTo(m.classCount());
      for (int c = 0; c < m.classCount(); c++) {
        assertThat(back.mixture(c).weights()).isEqualTo(m.mixture(c).weights());
        assertThat(back.mixture(c).means()).isDeepEqualTo(m.mixture(c).means());
        assertThat(back.mixture(c).covariances()).isDeepEqualTo(m.mixture(c).covariances());
      }
      long seed = rng.nextLong();
      assertThat(costsOnRandomPixels(back, new SplittableRandom(seed)))
          .isDeepEqualTo(costsOnRandomPixels(m, new SplittableRandom(seed)));
    }
  }

  private static JsonObject histogramJson() {
    return LikelihoodModelJson.toJson(randomHistogram(new SplittableRandom(1)));
  }

  private static JsonObject mixtureJson() {
    return LikelihoodModelJson.toJson(randomMixtureModel(new SplittableRandom(2)));
  }

  private static void assertDamaged(JsonObject base, Consumer<JsonObject> damage, String field) {
    JsonObject o = base.deepCopy();
    damage.accept(o);
    assertThatThrownBy(() -> LikelihoodModelJson.fromJson(o))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("'" + field + "'")
        .hasMessageContaining("damaged or from another program");
  }

  private static JsonObject firstClass(JsonObject o) {
    return o.getAsJsonArray("classes").get(0).getAsJsonObject();
  }

  @Test
  void malformedHistogramsAreReportedByField() {
    JsonObject h = histogramJson();
    assertDamaged(h, o -> o.remove("low"), "low");
    assertDamaged(h, o -> o.addProperty("high", "lots"), "high");
    assertDamaged(h, o -> o.addProperty("bins", 2.5), "bins");
    assertDamaged(h, o -> o.addProperty("channels", 3), "channels");
    assertDamaged(h, o -> o.addProperty("type", "decision-forest"), "type");
    assertDamaged(h, o -> o.add("type", new JsonArray()), "type");
    assertDamaged(
        h,
        o -> firstClass(o).getAsJsonArray("probabilities").remove(0),
        "classes[0].probabilities");
    assertDamaged(
        h,
        o -> firstClass(o).getAsJsonArray("probabilities").set(0, new JsonArray()),
        "classes[0].probabilities[0]");
    assertDamaged(
        h,
        o -> firstClass(o).getAsJsonArray("probabilities").set(0, JsonParser.parseString("-0.5")),
        "classes");
    assertDamaged(
        h,
        o -> {
          JsonArray classes = o.getAsJsonArray("classes");
          while (classes.size() > 1) {
            classes.remove(classes.size() - 1);
          }
        },
        "classes");
    assertDamaged(h, o -> o.addProperty("classes", 2), "classes");
  }

  @Test
  void malformedMixturesAreReportedByField() {
    JsonObject g = mixtureJson();
    int d = g.get("channels").getAsInt();
    assertDamaged(g, o -> firstClass(o).remove("weights"), "classes[0].weights");
    assertDamaged(
        g, o -> firstClass(o).getAsJsonArray("means").add(new JsonArray()), "classes[0].means");
    assertDamaged(
        g,
        o -> firstClass(o).getAsJsonArray("means").get(0).getAsJsonArray().add(1.0),
        "classes[0].means[0]");
    assertDamaged(g, o -> o.addProperty("channels", d + 1), "classes[0].means[0]");
    assertDamaged(
        g, o -> firstClass(o).add("covariances", new JsonObject()), "classes[0].covariances");
    // A covariance with a negative diagonal entry is not positive definite.
    assertDamaged(
        g,
        o -> {
          JsonArray s = firstClass(o).getAsJsonArray("covariances").get(0).getAsJsonArray();
          s.get(0).getAsJsonArray().set(0, JsonParser.parseString("-1.0"));
        },
        "classes[0]");
    JsonObject missingType = g.deepCopy();
    missingType.remove("type");
    assertThatThrownBy(() -> LikelihoodModelJson.fromJson(missingType))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("'type' is missing");
  }

  @Test
  void notPositiveDefiniteIsNamedInTheMessage() {
    JsonObject o = mixtureJson();
    JsonArray s = firstClass(o).getAsJsonArray("covariances").get(0).getAsJsonArray();
    s.get(0).getAsJsonArray().set(0, JsonParser.parseString("-1.0"));
    assertThatThrownBy(() -> LikelihoodModelJson.fromJson(o))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("not positive definite");
  }
}
