package io.github.cleave.flow;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

class NeighborhoodTest {

  @ParameterizedTest
  @EnumSource(Neighborhood.class)
  void directionsComeInOppositePairsAndAreDistinct(Neighborhood n) {
    Set<String> seen = new HashSet<>();
    for (int k = 0; k < n.size(); k++) {
      int o = Neighborhood.opposite(k);
      assertThat(n.dx(o)).isEqualTo(-n.dx(k));
      assertThat(n.dy(o)).isEqualTo(-n.dy(k));
      assertThat(n.dz(o)).isEqualTo(-n.dz(k));
      assertThat(seen.add(n.dx(k) + "," + n.dy(k) + "," + n.dz(k))).isTrue();
      assertThat(n.directionOf(n.dx(k), n.dy(k), n.dz(k))).isEqualTo(k);
      if (!n.isThreeDimensional()) {
        assertThat(n.dz(k)).isZero();
      }
    }
    assertThat(seen).hasSize(n.size());
  }

  @Test
  void largerNeighborhoodsExtendSmallerOnes() {
    for (Neighborhood[] chain :
        new Neighborhood[][] {
          {Neighborhood.N4, Neighborhood.N8, Neighborhood.N16},
          {Neighborhood.N6, Neighborhood.N18, Neighborhood.N26}
        }) {
      for (int i = 1; i < chain.length; i++) {
        for (int k = 0; k < chain[i - 1].size(); k++) {
          assertThat(chain[i].dx(k)).isEqualTo(chain[i - 1].dx(k));
          assertThat(chain[i].dy(k)).isEqualTo(chain[i - 1].dy(k));
          assertThat(chain[i].dz(k)).isEqualTo(chain[i - 1].dz(k));
        }
      }
    }
  }

  @Test
  void neighborhoodsByCount() {
    assertThat(Neighborhood.of(16)).isEqualTo(Neighborhood.N16);
    assertThat(Neighborhood.of(26)).isEqualTo(Neighborhood.N26);
    assertThat(Neighborhood.N16.reach()).isEqualTo(2);
    assertThat(Neighborhood.N26.reach()).isEqualTo(1);
    assertThatThrownBy(() -> Neighborhood.of(10))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("4, 8 or 16");
  }
}
