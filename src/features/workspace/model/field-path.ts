/** Read and write a study field by its dotted path (the same path the schema's issues use). */
export function getAt(root: unknown, path: string): unknown {
  let node: unknown = root;
  for (const key of path.split('.')) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[key];
  }
  return node;
}

export function setAt(root: object, path: string, value: unknown): void {
  const keys = path.split('.');
  let node = root as Record<string, unknown>;
  for (const key of keys.slice(0, -1)) node = node[key] as Record<string, unknown>;
  node[keys[keys.length - 1]] = value;
}
