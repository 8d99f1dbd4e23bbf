package io.github.cleave.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import io.github.cleave.image.BadInputException;
import io.github.cleave.image.Raster;
import io.github.cleave.objects.ObjectSettings;
import io.github.cleave.objects.ObjectSplit;
import io.github.cleave.segment.IlluminationMode;
import io.github.cleave.segment.SegmentationModel;
import io.github.cleave.segment.SegmentationSettings;
import io.github.cleave.segment.Segmenter;
import io.github.cleave.synth.Phantom;
import io.github.cleave.synth.SamplePhantoms;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Model files: exact round trip of every setting and of the learned likelihoods; clear refusals.
 */
class ModelFilesTest {

  @Test
  void roundTripKeepsSettingsAndCosts(@TempDir Path dir) throws IOException {
    for (Phantom p :
        new Phantom[] {SamplePhantoms.nuclei(5, 128, 128), SamplePhantoms.stained(6, 128, 128)}) {
      SegmentationSettings settings =
          SegmentationSettings.defaults()
              .withBoundaryPenalty(3.25)
              .withRefinementRounds(1)
              .withMeasuredChannels(new int[] {0})
              .withIllumination(IlluminationMode.OFF, 40)
              .withObjects(new ObjectSettings(true, ObjectSplit.PER_STROKE, 2.5, 900, true, false));
      SegmentationModel model = Segmenter.learn(p.image(), p.seeds(), settings);
      Path file = dir.resolve(p.name() + ".json");
      ModelFiles.write(file, model);
      SegmentationModel read = ModelFiles.read(file);
      assertThat(read.settings()).isEqualTo(model.settings());
      assertThat(read.contrastScale()).isEqualTo(model.contrastScale());
      assertThat(read.voxelSize()).isEqualTo(model.voxelSize());
      assertThat(read.imageChannels()).isEqualTo(model.imageChannels());
      assertThat(read.likelihoodRefined()).isTrue().isEqualTo(model.likelihoodRefined());
      Raster features = p.image().selectChannels(model.settings().drivingChannels());
      int n = features.size();
      float[][] before = new float[2][n];
      float[][] after = new float[2][n];
      model.likelihood().costs(features, before);
      read.likelihood().costs(features, after);
      assertThat(after).isDeepEqualTo(before);
      // the same bytes when written again
      Path again = dir.resolve(p.name() + "-again.json");
      ModelFiles.write(again, read);
      assertThat(Files.readAllBytes(again)).isEqualTo(Files.readAllBytes(file));
    }
  }

  @Test
  void newerFormatAndDamagedFieldsAreRefusedByName(@TempDir Path dir) throws IOException {
    Phantom p = SamplePhantoms.nuclei(7, 96, 96);
    Path file = dir.resolve("m.json");
    ModelFiles.write(file, Segmenter.learn(p.image(), p.seeds(), SegmentationSettings.defaults()));
    String text = Files.readString(file, StandardCharsets.UTF_8);
    Path newer = dir.resolve("newer.json");
    Files.writeString(newer, text.replace("\"formatVersion\": 1", "\"formatVersion\": 9"));
    assertThatThrownBy(() -> ModelFiles.read(newer))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("newer.json")
        .hasMessageContaining("update Cleave");
    Path damaged = dir.resolve("damaged.json");
    Files.writeString(damaged, text.replace("\"boundaryPenalty\"", "\"boundaryPenaltyX\""));
    assertThatThrownBy(() -> ModelFiles.read(damaged))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("boundaryPenalty");
    assertThatThrownBy(() -> ModelFiles.read(dir.resolve("missing.json")))
        .isInstanceOf(BadInputException.class)
        .hasMessageContaining("does not exist");
  }

  @Test
  void aFileWithoutTheRefinedMarkReadsAsSeedLearned(@TempDir Path dir) throws IOException {
    // model files written before the mark existed: their likelihoods came from the strokes alone,
    // so applying them keeps re-learning for the model's rounds
    Phantom p = SamplePhantoms.nuclei(9, 128, 128);
    SegmentationModel model =
        Segmenter.learn(p.image(), p.seeds(), SegmentationSettings.defaults());
    Path file = dir.resolve("old.json");
    ModelFiles.write(file, model);
    String json = Files.readString(file, StandardCharsets.UTF_8);
    assertThat(json).contains("\"likelihoodRefined\": true");
    Files.writeString(
        file, json.replace(",\n  \"likelihoodRefined\": true", ""), StandardCharsets.UTF_8);
    assertThat(Files.readString(file, StandardCharsets.UTF_8)).doesNotContain("likelihoodRefined");
    SegmentationModel read = ModelFiles.read(file);
    assertThat(read.likelihoodRefined()).isFalse();
    assertThat(read.roundsWhenApplied()).isEqualTo(model.settings().refinementRounds());
    assertThat(model.roundsWhenApplied()).isZero();
  }
}
