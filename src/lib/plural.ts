// Counts in words: "1 node", "3 nodes". The plural is given when adding "s" is wrong ("1 finding is", "2 findings are").
export function plural(count: number, one: string, many = `${one}s`): string {
  return `${count.toLocaleString("en")} ${count === 1 ? one : many}`;
}
