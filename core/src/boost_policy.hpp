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

// Boost calls these through the user_error policy. The message Boost builds is for programmers
// and never reaches a user; callers check their own preconditions and keep the work within what
// the methods handle (discrete_tail.hpp, the Cornish–Fisher branch of cramers_v_interval.cpp, the
// Chernoff bound of power.cpp), so reaching here means numbers beyond what a method can compute.
// The texts say so in the user's terms.
template <class T>
T user_domain_error(const char*, const char*, const T&) {
    throw assoc::Error("the numbers are outside the range this calculation accepts");
}
template <class T>
T user_pole_error(const char*, const char*, const T&) {
    throw assoc::Error("the calculation has no value for these numbers");
}
template <class T>
T user_overflow_error(const char*, const char*, const T&) {
    throw assoc::Error("the result is larger than a spreadsheet number can hold (above 1.8e308)");
}
template <class T>
T user_evaluation_error(const char*, const char*, const T&) {
    throw assoc::Error("the calculation could not settle on a value for numbers this extreme");
}
template <class T, class TargetType>
T user_rounding_error(const char*, const char*, const T&, const TargetType&) {
    throw assoc::Error("the numbers are too large for this calculation");
}
template <class T>
T user_indeterminate_result_error(const char*, const char*, const T&) {
    throw assoc::Error("the calculation has no value for these numbers");
}

}  // namespace boost::math::policies
