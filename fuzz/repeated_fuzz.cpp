// Fuzz target: Cochran's Q for answers given on several occasions by the same people (cochrans_q_test),
// with the answers as 1/0 or as labels and the "yes" label from the input.
// Input: section 1, the answers (one row per person); section 2 may give the yes label or number.
// Checks: only assoc::Error leaves the core; the p-value in [0, 1]; Q ≥ 0; df = occasions − 1; the
// people used and set aside add up to the rows; remarks in Assoc's words.
#include "assoc/cochrans_q.hpp"
#include "fuzz_support.hpp"

using namespace assoc;
using namespace assoc::fuzz;

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
    const auto sections = read_sections(data, size);
    const CellGrid& answers = section(sections, 0);
    const CellGrid& arguments = section(sections, 1);
    const Cell yes = arguments.empty() ? Cell() : arguments.at(0, 0);
    attempt("cochrans_q_test", [&] {
        const RepeatedResult result = cochrans_q_test(answers, yes);
        check_probability(result.p_value, "Q p-value");
        check_nonnegative(result.statistic, "Q");
        if (result.df != static_cast<double>(result.occasions) - 1) finding("df is not occasions − 1");
        if (result.people + result.set_aside > answers.rows()) finding("more people than rows");
        for (const std::string& remark : result.remarks) check_message(remark, "remark");
    });
    return 0;
}
