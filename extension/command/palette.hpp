#pragma once
// The colours of the analysis sheet. scripts/build_samples.py uses the same heat map (HEAT_MAP
// there), and tests/calc/command_test.py checks that the two agree.
#include <array>
#include <cstdint>

namespace assoc::command::palette {

// The heat map of adjusted residuals: a three-point colour scale, from purple at −3 (fewer counts
// than independence predicts) through near-white at 0 to orange at +3 (more); values beyond ±3
// take the end colours. The three colours are ColorBrewer's diverging scheme "PuOr" with 3
// classes (Cynthia Brewer, colorbrewer2.org; Harrower & Brewer 2003, "ColorBrewer.org: an online
// tool for selecting colour schemes for maps", The Cartographic Journal 40(1), 27–37), which
// ColorBrewer marks as safe for colour-blind readers; the RGB values as in ColorBrewer's
// colorbrewer_schemes.js: PuOr 3 = rgb(241,163,64), rgb(247,247,247), rgb(153,142,195).
struct ScalePoint {
    int value;
    std::uint32_t colour;
};
inline constexpr std::array<ScalePoint, 3> heat_map{{{-3, 0x998EC3}, {0, 0xF7F7F7}, {3, 0xF1A340}}};

// Bars of the chart, one colour per column of the table (cycled past seven): Paul Tol's
// qualitative scheme "bright", designed to stay distinct for colour-blind readers (P. Tol,
// "Colour schemes", SRON technical note SRON/EPS/TN/09-002, https://personal.sron.nl/~pault/).
inline constexpr std::array<std::uint32_t, 7> chart_series{0x4477AA, 0xEE6677, 0x228833, 0xCCBB44,
                                                            0x66CCEE, 0xAA3377, 0xBBBBBB};

// Text and rules (our own greys).
inline constexpr std::uint32_t heading_rule = 0x333333;
inline constexpr std::uint32_t note_text = 0x555555;
inline constexpr std::uint32_t input_fill = 0xFFF6D5;  // the cell the user may change (alpha)
inline constexpr std::uint32_t caution_text = 0x7A2E2E;

}  // namespace assoc::command::palette
