package io.github.cleave.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.BadInputException;
import io.github.cleave.image.PixelKind;
import io.github.cleave.image.Raster;
import io.github.cleave.image.SeedLabels;
import io.github.cleave.image.VoxelSize;
import org.junit.jupiter.api.Test;

class ModelLearnerTest {
  private static final Raster GREY =
      TestImages.row(PixelKind.GREY8, new float[] {1, 2, 3, 4, 5, 6});

  private static LikelihoodModel learn(Raster r, byte[] labels, ModelKind kind) {
    return ModelLearner.learn(r, TestImages.seeds(labels), kind);
  }

  @Test
  void missingBackgroundIsReported() {
    assertThatThrownBy(() -> learn(GREY, new byte[] {1, 1, 0, 0, 0, 0}, ModelKind.AUTO))
        .isInstanceOf(BadInputException.class)
        .hasMessage("no background seed (label 2): paint at least one background stroke");
  }

  @Test
  void missingForegroundIsReported() {
    assertThatThrownBy(() -> learn(GREY, new byte[] {2, 2, 0, 0, 0, 0}, ModelKind.AUTO))
        .isInstanceOf(BadInputException.class)
        .hasMessageStartingWith("no foreground seed (label 1)")
        .hasMessageContaining("paint at least one foreground stroke");
  }

  @Test
  void noSeedsAtAllIsReported() {
    assertThatThrownBy(() -> learn(GREY, new byte[6], ModelKind.AUTO))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("no seeds")
        .hasMessageContaining("foreground stroke (label 1)");
  }

  @Test
  void aGapInTheClassLabelsIsReported() {
    assertThatThrownBy(() -> learn(GREY, new byte[] {1, 2, 4, 0, 0, 0}, ModelKind.AUTO))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("class 3 (label 3)")
        .hasMessageContaining("renumber");
  }

  @Test
  void seedsOfAnotherSizeAreReportedWithBothSizes() {
    Raster r = new Raster(3, 2, 1, new float[][] {new float[6]}, VoxelSize.PIXELS, PixelKind.GREY8);
    SeedLabels s = new SeedLabels(2, 3, 1, new byte[] {1, 2, 0, 0, 0, 0});
    assertThatThrownBy(() -> ModelLearner.learn(r, s, ModelKind.AUTO))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("2 x 3 x 1")
        .hasMessageContaining("3 x 2 x 1");
  }

  @Test
  void histogramOfThreeChannelsIsRefused() {
    float[] v = {1, 2, 3};
    Raster rgb = TestImages.row(PixelKind.RGB, v, v, v);
    assertThatThrownBy(() -> learn(rgb, new byte[] {1, 2, 0}, ModelKind.HISTOGRAM))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("has 3")
        .hasMessageContaining("choose one channel or the Gaussian mixture model");
  }

  @Test
  void seedsOnlyOnNanPixelsAreReported() {
    Raster r = TestImages.row(PixelKind.FLOAT32, new float[] {Float.NaN, 2, 3});
    assertThatThrownBy(() -> learn(r, new byte[] {1, 2, 0}, ModelKind.AUTO))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("foreground seed (label 1)")
        .hasMessageContaining("NaN");
  }

  @Test
  void autoChoosesByChannelCount() {
    float[] v = {1, 2, 3};
    assertThat(learn(TestImages.row(PixelKind.GREY8, v), new byte[] {1, 2, 0}, ModelKind.AUTO))
        .isInstanceOf(HistogramModel.class);
    assertThat(learn(TestImages.row(PixelKind.FLOAT32, v, v), new byte[] {1, 2, 0}, ModelKind.AUTO))
        .isInstanceOf(GaussianMixtureModel.class);
    LikelihoodModel one =
        learn(TestImages.row(PixelKind.GREY8, v), new byte[] {1, 2, 3}, ModelKind.GAUSSIAN_MIXTURE);
    assertThat(one).isInstanceOf(GaussianMixtureModel.class);
    assertThat(one.classCount()).isEqualTo(3);
    assertThat(one.channelCount()).isEqualTo(1);
  }

  @Test
  void histogramRangeFollowsThePixelKind() {
    float[] v = {1000, 1010, 1200, Float.NaN, 900};
    byte[] labels = {1, 2, 0, 0, 0};
    HistogramModel g16 =
        (HistogramModel) learn(TestImages.row(PixelKind.GREY16, v), labels, ModelKind.AUTO);
    assertThat(g16.low()).isEqualTo(900);
    assertThat(g16.high()).isEqualTo(1200);
    assertThat(g16.binCount()).isEqualTo(256);
    HistogramModel narrow =
        (HistogramModel)
            learn(
                TestImages.row(PixelKind.GREY16, new float[] {7, 9, 12}),
                new byte[] {1, 2, 0},
                ModelKind.AUTO);
    assertThat(narrow.binCount()).isEqualTo(6);
    HistogramModel flat =
        (HistogramModel)
            learn(
                TestImages.row(PixelKind.FLOAT32, new float[] {5, 5}),
                new byte[] {1, 2},
                ModelKind.AUTO);
    assertThat(flat.low()).isEqualTo(5);
    assertThat(flat.high()).isEqualTo(6);
    HistogramModel g8 = (HistogramModel) learn(GREY, new byte[] {1, 2, 0, 0, 0, 0}, ModelKind.AUTO);
    assertThat(g8.low()).isZero();
    assertThat(g8.high()).isEqualTo(255);
  }

  @Test
  void costArgumentsAreChecked() {
    LikelihoodModel m = learn(GREY, new byte[] {1, 2, 0, 0, 0, 0}, ModelKind.AUTO);
    assertThatThrownBy(() -> m.costs(GREY, new float[1][6]))
        .isInstanceOf(IllegalArgumentException.class);
    assertThatThrownBy(() -> m.costs(GREY, new float[2][5]))
        .isInstanceOf(IllegalArgumentException.class);
    float[] v = new float[6];
    assertThatThrownBy(() -> m.costs(TestImages.row(PixelKind.RGB, v, v, v), new float[2][6]))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("3 channel");
  }
}
