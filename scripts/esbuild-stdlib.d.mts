/** Rewrites a CommonJS @stdlib file in the regular style to an ES module, or returns null. */
export function esmify(src: string): string | null;
