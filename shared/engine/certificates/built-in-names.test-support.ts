// Names every JavaScript object, function, array or string inherits, for tests that use them as node names.

/** Own property names of the common prototypes, plus __proto__ (an accessor on Object.prototype, listed there too). */
export const BUILT_IN_NAMES = [
  ...new Set([
    ...Object.getOwnPropertyNames(Object.prototype),
    ...Object.getOwnPropertyNames(Function.prototype),
    ...Object.getOwnPropertyNames(Array.prototype),
    ...Object.getOwnPropertyNames(String.prototype),
    "__proto__",
  ]),
];
