package dev.touchstone.reports.charts;

import org.junit.jupiter.api.Test;

import java.awt.Color;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

class DifferenceHeatMapTest {

    @Test
    void theScaleRunsFromBlueThroughNearWhiteToRed() {
        // End and middle colours of the diverging blue-red scheme (Tol 2021; values from memory).
        assertEquals(new Color(0x21, 0x66, 0xAC), DifferenceHeatMap.colour(2, 2));
        assertEquals(new Color(0xF7, 0xF7, 0xF7), DifferenceHeatMap.colour(0, 2));
        assertEquals(new Color(0xB2, 0x18, 0x2B), DifferenceHeatMap.colour(-2, 2));
        // halfway: each channel halfway between near-white and the end, rounded (worked by hand: (247 + 33) / 2 = 140)
        assertEquals(140, DifferenceHeatMap.colour(1, 2).getRed());
        assertEquals(DifferenceHeatMap.colour(5, 2), DifferenceHeatMap.colour(2, 2), "clamped beyond the scale");
    }

    @Test
    void lowerIsBetterTurnsTheSign() {
        // SHD lower is better: a configuration 3 edges below the reference is better, drawn blue; 3 above, red.
        DifferenceHeatMap.Block shd = new DifferenceHeatMap.Block("shd", "structural Hamming distance", false,
                List.of("ges", "lingam"));
        String svg = new DifferenceHeatMap("t", List.of(shd), List.of("nodes=8"), List.of(
                new DifferenceHeatMap.Cell("shd", "ges", "nodes=8", -3, 0.01),
                new DifferenceHeatMap.Cell("shd", "lingam", "nodes=8", 3, 0.5))).toSvg(600);
        assertTrue(svg.contains("rgb(33,102,172)"), "the better cell is blue");
        assertTrue(svg.contains("rgb(178,24,43)"), "the worse cell is red");
        assertTrue(svg.contains(">-3.0<") && svg.contains(">+3.0<"), "values printed with their sign");
    }
}
