/**
 * The report's sources appendix: every method of the audit trail that names a published source
 * gets its full citation, and the bare labels for values without a printed source are put in words.
 */
import { describe, expect, it } from "vitest";
import { STUDY_METHODS } from "../../lib/study/audit";
import { SIEGERT_SOURCE } from "../../lib/plant/siegert";
import { citationNumbers, citationsIn, plainSource } from "../../app/studies/[id]/report/sources";

describe("report sources", () => {
  it("every method is cited in full or says it rests on common practice", () => {
    const list = citationsIn(STUDY_METHODS.map((m) => m.source));
    const uncited = STUDY_METHODS.filter((m) => !/common practice/.test(m.source) && citationNumbers(m.source, list).length === 0);
    expect(uncited.map((m) => m.quantity)).toEqual([]);
  });

  it("lists a citation once, in the order of first mention", () => {
    const list = citationsIn(["Gordon & McBride, NASA RP-1311 (1994)", "ISO 6976:2016", "again NASA RP-1311"]);
    expect(list.map((c) => c.key)).toEqual(["nasa-rp1311", "iso6976"]);
    expect(list[1].text).toMatch(/^ISO 6976:2016\. Natural gas — Calculation of calorific values/);
  });

  it("cites the regulation behind the Siegert cross-check and the acid dew point correlation", () => {
    const keys = citationsIn([SIEGERT_SOURCE, "acid dew point by Verhoff & Banchero (1974)"]).map((c) => c.key);
    expect(keys).toEqual(["bimschv", "verhoff"]);
  });

  it("puts 'common practice, no source' and 'value from memory' in plain words", () => {
    const a = plainSource("rated-load radiation loss as boiler makers state it (common practice, no source)");
    expect(a.commonPractice).toBe(true);
    expect(a.text).not.toMatch(/no source\)|common practice/);
    expect(a.text).toMatch(/usual engineering practice; no single published source/);
    const b = plainSource("unburnt carbon at 14 500 Btu/lbm (ASME PTC 4, value from memory)");
    expect(b.fromMemory).toBe(true);
    expect(b.text).toBe("unburnt carbon at 14 500 Btu/lbm (ASME PTC 4; quoted from memory, not checked against the printed edition)");
  });
});
