// How the browser splits a checked CSV into import requests. A row's alternates may name rows of the
// same file, and the server resolves those only within one request, so rows linked to each other
// (directly or through others) travel together.

export interface ReadyRow {
  row: number;
  record: Record<string, string>;
  partNumber: string;
  alternateNames: string[];
}

export function chunkRows(rows: ReadyRow[], chunkSize: number, maxRows: number): ReadyRow[][] {
  const parent = new Map<string, string>();
  const find = (name: string): string => {
    let root = name;
    while (parent.has(root) && parent.get(root) !== root) root = parent.get(root)!;
    parent.set(name, root);
    return root;
  };
  const union = (a: string, b: string) => {
    const [ra, rb] = [find(a), find(b)];
    if (ra !== rb) parent.set(rb, ra);
  };
  for (const row of rows) {
    find(row.partNumber);
    for (const name of row.alternateNames) union(row.partNumber, name);
  }

  const groups = new Map<string, ReadyRow[]>();
  for (const row of rows) {
    const root = find(row.partNumber);
    groups.set(root, [...(groups.get(root) ?? []), row]);
  }

  const chunks: ReadyRow[][] = [];
  let current: ReadyRow[] = [];
  for (const group of groups.values()) {
    if (current.length && current.length + group.length > chunkSize) {
      chunks.push(current);
      current = [];
    }
    // A group larger than one request allows is split; links across the split are reported by the server.
    for (let start = 0; start < group.length; start += maxRows) {
      const piece = group.slice(start, start + maxRows);
      if (current.length + piece.length > maxRows) {
        chunks.push(current);
        current = [];
      }
      current.push(...piece);
    }
  }
  if (current.length) chunks.push(current);
  return chunks.map((chunk) => chunk.sort((a, b) => a.row - b.row));
}
