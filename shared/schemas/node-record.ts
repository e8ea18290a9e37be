// Records keyed by node names (fixed inputs, certificate contexts). zod leaves a `__proto__` key out of a parsed
// record without an issue, because assigning it to the plain object it builds would set that object's prototype;
// a caller would then see a request accepted with one of its entries silently gone. Such a key is refused instead.
import { z } from "zod";

export const PROTOTYPE_KEY_MESSAGE = "__proto__ cannot name a node";

/**
 * z.record(key, value) that refuses an own `__proto__` key with an issue at that key. Typed as the plain record: the
 * check in front only adds an issue and passes the value on unchanged, so input and output types are the record's
 * (z.preprocess alone would type the input as unknown and let callers build any body).
 */
export function nodeRecord<K extends z.core.$ZodRecordKey, V extends z.ZodType>(key: K, value: V): z.ZodRecord<K, V> {
  const record = z.record(key, value);
  return z.preprocess((raw, ctx) => {
    if (typeof raw === "object" && raw !== null && Object.hasOwn(raw, "__proto__"))
      ctx.addIssue({ code: "custom", message: PROTOTYPE_KEY_MESSAGE, path: ["__proto__"], input: raw });
    return raw;
  }, record) as unknown as z.ZodRecord<K, V>;
}
