/**
 * Records a field's message unless the field already has one (the first problem found is the one shown). Defined,
 * not assigned, so a field named "__proto__" is reported rather than swapping the object's prototype.
 */
export function setField(out: Record<string, string>, path: string, message: string): void {
  if (!Object.hasOwn(out, path)) Object.defineProperty(out, path, { value: message, enumerable: true, writable: true, configurable: true });
}
