/** Id lists reach the database in slices of at most ID_CHUNK, each id once, in order. */
import { describe, expect, it } from "vitest";
import { groupBy, ID_CHUNK, inChunks } from "../../lib/db/chunks";

describe("inChunks", () => {
  it("asks for 1,234 ids (some repeated) in slices of at most 500, each id once, and joins the answers in order", async () => {
    const ids = Array.from({ length: 1234 }, (_, i) => i + 1).concat([5, 6, 7]);
    const asked: number[][] = [];
    const rows = await inChunks(ids, async (chunk) => {
      asked.push(chunk);
      return chunk.map((id) => ({ id }));
    });
    expect(ID_CHUNK).toBeLessThan(999); // SQLite's default limit of parameters per statement (SQLITE_MAX_VARIABLE_NUMBER before 3.32.0)
    expect(asked.map((c) => c.length)).toEqual([500, 500, 234]);
    expect(rows.map((r) => r.id)).toEqual(Array.from({ length: 1234 }, (_, i) => i + 1));
  });

  it("asks nothing for no ids", async () => {
    let calls = 0;
    expect(await inChunks([], async () => [calls++])).toEqual([]);
    expect(calls).toBe(0);
  });
});

describe("groupBy", () => {
  it("groups rows by key, keeping their order", () => {
    const g = groupBy(
      [
        { k: 2, v: "a" },
        { k: 1, v: "b" },
        { k: 2, v: "c" },
      ],
      (r) => r.k,
    );
    expect(g.get(2)!.map((r) => r.v)).toEqual(["a", "c"]);
    expect(g.get(1)!.map((r) => r.v)).toEqual(["b"]);
  });
});
