package io.github.cleave.io;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonPrimitive;
import io.github.cleave.image.BadInputException;
import io.github.cleave.model.GaussianMixture;
import io.github.cleave.model.GaussianMixtureModel;
import io.github.cleave.model.HistogramModel;
import io.github.cleave.model.LikelihoodModel;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * A {@link LikelihoodModel} as a JSON object, the part of a model file that holds the learned
 * likelihoods. Two forms, told apart by {@code "type"}:
 *
 * <pre>
 * {"type": "histogram", "channels": 1, "low": 0.0, "high": 255.0, "bins": 256,
 *  "classes": [{"probabilities": [B numbers]}, ...]}
 * {"type": "gaussian-mixture", "channels": d,
 *  "classes": [{"weights": [K], "means": [K x [d]], "covariances": [K x [d x [d]]]}, ...]}
 * </pre>
 *
 * Classes are in model order (foreground, background, further classes). Numbers are written with
 * {@link Double#toString} precision, so {@code fromJson(toJson(m))} has exactly the parameters of
 * {@code m} and gives the same costs bit for bit. Reading checks every field and fails with a
 * {@link BadInputException} naming the field and saying that the file is damaged or from another
 * program. Stateless; thread-safe.
 */
public final class LikelihoodModelJson {
  /** Type name of a {@link HistogramModel}. */
  public static final String HISTOGRAM = "histogram";

  /** Type name of a {@link GaussianMixtureModel}. */
  public static final String GAUSSIAN_MIXTURE = "gaussian-mixture";

  private LikelihoodModelJson() {}

  /**
   * The JSON form of {@code m}.
   *
   * @throws IllegalArgumentException if {@code m} is neither a histogram nor a mixture model
   */
  public static JsonObject toJson(LikelihoodModel m) {
    JsonObject o = new JsonObject();
    JsonArray classes = new JsonArray();
    if (m instanceof HistogramModel h) {
      o.addProperty("type", HISTOGRAM);
      o.addProperty("channels", 1);
      o.addProperty("low", h.low());
      o.addProperty("high", h.high());
      o.addProperty("bins", h.binCount());
      for (int c = 0; c < h.classCount(); c++) {
        JsonObject k = new JsonObject();
        k.add("probabilities", vector(h.probabilities(c)));
        classes.add(k);
      }
    } else if (m instanceof GaussianMixtureModel g) {
      o.addProperty("type", GAUSSIAN_MIXTURE);
      o.addProperty("channels", g.channelCount());
      for (int c = 0; c < g.classCount(); c++) {
        GaussianMixture mix = g.mixture(c);
        JsonObject k = new JsonObject();
        k.add("weights", vector(mix.weights()));
        JsonArray means = new JsonArray();
        for (double[] mu : mix.means()) {
          means.add(vector(mu));
        }
        k.add("means", means);
        JsonArray covariances = new JsonArray();
        for (double[][] s : mix.covariances()) {
          JsonArray rows = new JsonArray();
          for (double[] row : s) {
            rows.add(vector(row));
          }
          covariances.add(rows);
        }
        k.add("covariances", covariances);
        classes.add(k);
      }
    } else {
      throw new IllegalArgumentException(
          "no JSON form for likelihood model " + m.getClass().getName());
    }
    o.add("classes", classes);
    return o;
  }

  private static JsonArray vector(double[] v) {
    JsonArray a = new JsonArray(v.length);
    for (double x : v) {
      a.add(x);
    }
    return a;
  }

  /**
   * The model described by {@code o}.
   *
   * @throws BadInputException naming the field when a field is missing, of the wrong type or
   *     length, or describes an invalid model (e.g. a covariance that is not positive definite)
   */
  public static LikelihoodModel fromJson(JsonObject o) {
    JsonElement typeElement = field(o, "type", "type");
    if (!typeElement.isJsonPrimitive() || !typeElement.getAsJsonPrimitive().isString()) {
      throw damaged("type", "is not a string");
    }
    String type = typeElement.getAsString();
    int channels = count(field(o, "channels", "channels"), "channels");
    JsonArray classes = array(field(o, "classes", "classes"), "classes", -1);
    if (classes.size() < 2) {
      throw damaged("classes", "has " + classes.size() + " entries; at least 2 are needed");
    }
    if (HISTOGRAM.equals(type)) {
      return histogram(o, channels, classes);
    }
    if (GAUSSIAN_MIXTURE.equals(type)) {
      return mixture(channels, classes);
    }
    throw damaged(
        "type", "is '" + type + "'; expected '" + HISTOGRAM + "' or '" + GAUSSIAN_MIXTURE + "'");
  }

  private static HistogramModel histogram(JsonObject o, int channels, JsonArray classes) {
    if (channels != 1) {
      throw damaged("channels", "is " + channels + "; a histogram model has 1 channel");
    }
    double low = number(field(o, "low", "low"), "low");
    double high = number(field(o, "high", "high"), "high");
    int bins = count(field(o, "bins", "bins"), "bins");
    double[][] p = new double[classes.size()][];
    for (int c = 0; c < p.length; c++) {
      String path = "classes[" + c + "]";
      JsonObject k = object(classes.get(c), path);
      p[c] =
          vector(field(k, "probabilities", path + ".probabilities"), path + ".probabilities", bins);
    }
    try {
      return HistogramModel.of(low, high, p);
    } catch (IllegalArgumentException e) {
      throw damaged("classes", "describes no valid histogram model (" + e.getMessage() + ")");
    }
  }

  private static GaussianMixtureModel mixture(int d, JsonArray classes) {
    List<GaussianMixture> mixtures = new ArrayList<>();
    for (int c = 0; c < classes.size(); c++) {
      String path = "classes[" + c + "]";
      JsonObject k = object(classes.get(c), path);
      double[] weights = vector(field(k, "weights", path + ".weights"), path + ".weights", -1);
      int n = weights.length;
      if (n == 0) {
        throw damaged(path + ".weights", "is empty; a mixture needs at least one component");
      }
      JsonArray meansArray = array(field(k, "means", path + ".means"), path + ".means", n);
      double[][] means = new double[n][];
      for (int j = 0; j < n; j++) {
        means[j] = vector(meansArray.get(j), path + ".means[" + j + "]", d);
      }
      String covPath = path + ".covariances";
      JsonArray covArray = array(field(k, "covariances", covPath), covPath, n);
      double[][][] cov = new double[n][d][];
      for (int j = 0; j < n; j++) {
        JsonArray rows = array(covArray.get(j), covPath + "[" + j + "]", d);
        for (int i = 0; i < d; i++) {
          cov[j][i] = vector(rows.get(i), covPath + "[" + j + "][" + i + "]", d);
        }
      }
      try {
        mixtures.add(GaussianMixture.of(weights, means, cov));
      } catch (IllegalArgumentException e) {
        throw damaged(path, "describes no valid mixture (" + e.getMessage() + ")");
      }
    }
    return GaussianMixtureModel.of(mixtures);
  }

  private static JsonElement field(JsonObject o, String name, String path) {
    JsonElement e = o.get(name);
    if (e == null || e.isJsonNull()) {
      throw damaged(path, "is missing");
    }
    return e;
  }

  private static JsonObject object(JsonElement e, String path) {
    if (!e.isJsonObject()) {
      throw damaged(path, "is not an object");
    }
    return e.getAsJsonObject();
  }

  private static JsonArray array(JsonElement e, String path, int length) {
    if (!e.isJsonArray()) {
      throw damaged(path, "is not an array");
    }
    JsonArray a = e.getAsJsonArray();
    if (length >= 0 && a.size() != length) {
      throw damaged(
          path, String.format(Locale.ROOT, "has %d entries; %d expected", a.size(), length));
    }
    return a;
  }

  private static double[] vector(JsonElement e, String path, int length) {
    JsonArray a = array(e, path, length);
    double[] v = new double[a.size()];
    for (int i = 0; i < v.length; i++) {
      v[i] = number(a.get(i), path + "[" + i + "]");
    }
    return v;
  }

  private static double number(JsonElement e, String path) {
    if (!e.isJsonPrimitive() || !e.getAsJsonPrimitive().isNumber()) {
      throw damaged(path, "is not a number");
    }
    double v;
    try {
      v = e.getAsDouble();
    } catch (NumberFormatException ex) {
      throw damaged(path, "is not a number");
    }
    if (!Double.isFinite(v)) {
      throw damaged(path, "is not a finite number");
    }
    return v;
  }

  private static int count(JsonElement e, String path) {
    double v = number(e, path);
    if (v != Math.rint(v) || v < 1 || v > 1 << 20) {
      throw damaged(
          path, "is " + new JsonPrimitive(v) + "; expected a whole number 1.." + (1 << 20));
    }
    return (int) v;
  }

  private static BadInputException damaged(String path, String problem) {
    return new BadInputException(
        "likelihood model: field '"
            + path
            + "' "
            + problem
            + ": the model file is damaged or from another program");
  }
}
