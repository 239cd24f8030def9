#pragma once
// Everything the Assoc core offers, in one include.
#include "assoc/cell.hpp"
#include "assoc/chi_squared_distribution.hpp"
#include "assoc/count_table.hpp"
#include "assoc/effect_size.hpp"
#include "assoc/error.hpp"
#include "assoc/expected_counts.hpp"
#include "assoc/format.hpp"
#include "assoc/matrix.hpp"
#include "assoc/residuals.hpp"
#include "assoc/statistics.hpp"
#include "assoc/validity.hpp"
