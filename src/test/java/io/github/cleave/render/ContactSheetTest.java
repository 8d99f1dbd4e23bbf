package io.github.cleave.render;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.awt.image.BufferedImage;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class ContactSheetTest {
  @Test
  void sizeDependsOnlyOnTileCountAndColumns() {
    List<ContactSheet.Tile> tiles = tiles(7);
    BufferedImage sheet = ContactSheet.render(tiles, 3);
    int tile = ContactSheet.THUMBNAIL + ContactSheet.GAP;
    assertThat(sheet.getWidth()).isEqualTo(ContactSheet.GAP + 3 * tile);
    assertThat(sheet.getHeight())
        .isEqualTo(ContactSheet.GAP + 3 * (tile + ContactSheet.CAPTION_HEIGHT));
    BufferedImage few = ContactSheet.render(tiles(2));
    assertThat(few.getWidth()).isEqualTo(ContactSheet.GAP + 2 * tile);
    assertThatThrownBy(() -> ContactSheet.render(List.of()))
        .isInstanceOf(IllegalArgumentException.class);
  }

  @Test
  void renderingIsDeterministicAndFailuresAreMarkedInVermillion() {
    List<ContactSheet.Tile> tiles = tiles(5);
    BufferedImage a = ContactSheet.render(tiles, 4);
    BufferedImage b = ContactSheet.render(tiles, 4);
    for (int y = 0; y < a.getHeight(); y++) {
      for (int x = 0; x < a.getWidth(); x++) {
        assertThat(a.getRGB(x, y)).isEqualTo(b.getRGB(x, y));
      }
    }
    // Tile 2 (0-based) failed: its frame is vermillion at the box's edge.
    int x0 = ContactSheet.GAP + 2 * (ContactSheet.THUMBNAIL + ContactSheet.GAP);
    assertThat(a.getRGB(x0 + 1, ContactSheet.GAP + 50) & 0xffffff).isEqualTo(0xD55E00);
    // Tile 0 shows its 4 x 4 picture scaled up: the centre has the picture's colour.
    int centre = ContactSheet.GAP + ContactSheet.THUMBNAIL / 2;
    assertThat(a.getRGB(centre, centre) & 0xffffff).isEqualTo(0x336699);
    // Captions are drawn: some dark text pixels below the thumbnail of tile 0.
    boolean text = false;
    for (int y = ContactSheet.GAP + ContactSheet.THUMBNAIL;
        y < ContactSheet.GAP + ContactSheet.THUMBNAIL + ContactSheet.CAPTION_HEIGHT;
        y++) {
      for (int x = ContactSheet.GAP; x < ContactSheet.GAP + ContactSheet.THUMBNAIL; x++) {
        text |= (a.getRGB(x, y) & 0xff) < 100;
      }
    }
    assertThat(text).isTrue();
  }

  private static List<ContactSheet.Tile> tiles(int n) {
    List<ContactSheet.Tile> tiles = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      BufferedImage p = new BufferedImage(4, 4, BufferedImage.TYPE_INT_RGB);
      for (int k = 0; k < 16; k++) {
        p.setRGB(k % 4, k / 4, 0x336699);
      }
      if (i == 2) {
        tiles.add(
            ContactSheet.Tile.failed(
                "image-" + i + ".tif",
                "seed file image-2.seeds.tif is 10 x 8 x 1 but the image is" + " 12 x 8 x 1"));
      } else if (i % 2 == 1) {
        tiles.add(ContactSheet.Tile.done("image-" + i + ".tif", p, 10 + i, 0.9 + i / 100.0));
      } else {
        tiles.add(ContactSheet.Tile.done("a-rather-long-file-name-number-" + i + ".tif", p, 1));
      }
    }
    return tiles;
  }
}
