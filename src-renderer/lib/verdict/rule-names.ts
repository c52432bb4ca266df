// Short names for the rule ids, for table rows and chart axes, from the core's rule catalogue.
// The findings' own messages carry the full sentence.

export { ruleName } from '$core/catalogue/rules';
