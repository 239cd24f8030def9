#pragma once
// Boost.Math's error policy for Assoc: every domain, pole, overflow or evaluation error
// is turned into assoc::Error, so that no Boost exception leaves the core. Underflow
// quietly gives 0 (a p-value below 1e-308 is shown as 0), denormals are kept.
#include <boost/math/policies/error_handling.hpp>
#include <boost/math/policies/policy.hpp>
#include <string>

#include "assoc/error.hpp"

namespace assoc::detail {

using namespace boost::math::policies;
using Policy = policy<domain_error<user_error>, pole_error<user_error>, overflow_error<user_error>,
                      evaluation_error<user_error>, rounding_error<user_error>, indeterminate_result_error<user_error>,
                      underflow_error<ignore_error>, denorm_error<ignore_error>, promote_double<false>>;

}  // namespace assoc::detail

namespace boost::math::policies {

// Boost calls these through the user_error policy. The message Boost builds is for
// programmers; callers check their own preconditions first, so reaching here means a
// value outside what the method can compute.
template <class T>
T user_domain_error(const char*, const char*, const T&) {
    throw assoc::Error("an argument is outside the range the calculation accepts");
}
template <class T>
T user_pole_error(const char*, const char*, const T&) {
    throw assoc::Error("the calculation is undefined for these values");
}
template <class T>
T user_overflow_error(const char*, const char*, const T&) {
    throw assoc::Error("the result is too large for a spreadsheet number");
}
template <class T>
T user_evaluation_error(const char*, const char*, const T&) {
    throw assoc::Error("the calculation did not converge for these values");
}
template <class T, class TargetType>
T user_rounding_error(const char*, const char*, const T&, const TargetType&) {
    throw assoc::Error("the result cannot be represented as a whole number");
}
template <class T>
T user_indeterminate_result_error(const char*, const char*, const T&) {
    throw assoc::Error("the result is undefined for these values");
}

}  // namespace boost::math::policies
