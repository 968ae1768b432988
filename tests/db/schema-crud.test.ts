/**
 * The committed migrations must produce the schema that schema.prisma describes: every model
 * is created, read, updated and deleted through the generated client on a freshly migrated
 * file, with every column written and read back, and the relations' delete rules checked.
 */
import { afterAll, describe, expect, it } from "vitest";
import { tempDb } from "./temp-db";

const t = await tempDb();
afterAll(() => t.cleanup());
const db = t.client;

describe("schema matches the migrations", () => {
  it("Fuel, BlendComponent, PriceQuote", async () => {
    const a = await db.fuel.create({
      data: {
        name: "A",
        kind: "gas",
        definition: '{"composition":{"CH4":1}}',
        densityKgPerM3: null,
        biogenicCarbonShare: 0.25,
        upstreamCo2e_kg_per_GJ: 7.5,
        notes: "n",
        source: "s",
        isDemo: true,
      },
    });
    expect(a).toMatchObject({ name: "A", biogenicCarbonShare: 0.25, upstreamCo2e_kg_per_GJ: 7.5, isDemo: true });
    expect(a.createdAt).toBeInstanceOf(Date);
    const b = await db.fuel.create({ data: { name: "B", kind: "liquid", definition: "{}", densityKgPerM3: 845.5 } });
    expect(b.densityKgPerM3).toBe(845.5);
    expect(b.biogenicCarbonShare).toBe(0);
    const blend = await db.fuel.create({ data: { name: "AB", kind: "gas", definition: "{}" } });
    await db.blendComponent.create({ data: { blendFuelId: blend.id, componentFuelId: a.id, share: 0.7, basis: "volume", position: 0 } });
    const q = await db.priceQuote.create({
      data: {
        fuelId: a.id,
        amount: 38.5,
        currency: "EUR",
        unit: "m3",
        energyBasis: null,
        meteringReference: "15C",
        transportAdder: 1.25,
        handlingAdder: 0.5,
        validFrom: new Date("2025-03-01T00:00:00Z"),
        sourceNote: "x",
        isInvented: true,
      },
    });
    const q2 = await db.priceQuote.findUniqueOrThrow({ where: { id: q.id } });
    expect(q2.validFrom.toISOString()).toBe("2025-03-01T00:00:00.000Z");
    expect(q2).toMatchObject({ meteringReference: "15C", transportAdder: 1.25, handlingAdder: 0.5, isInvented: true });
    await db.priceQuote.update({ where: { id: q.id }, data: { energyBasis: "gross", meteringReference: null } });
    expect((await db.priceQuote.findUniqueOrThrow({ where: { id: q.id } })).energyBasis).toBe("gross");

    // Unique name.
    await expect(db.fuel.create({ data: { name: "A", kind: "gas", definition: "{}" } })).rejects.toThrow();
    // A component cannot be deleted while a blend uses it (Restrict) ...
    await expect(db.fuel.delete({ where: { id: a.id } })).rejects.toThrow();
    // ... deleting the blend deletes its component rows (Cascade).
    await db.fuel.delete({ where: { id: blend.id } });
    expect(await db.blendComponent.count()).toBe(0);
    // Deleting a fuel deletes its quotes (Cascade).
    await db.fuel.delete({ where: { id: a.id } });
    expect(await db.priceQuote.count()).toBe(0);
    await db.fuel.update({ where: { id: b.id }, data: { notes: "updated" } });
    expect((await db.fuel.findUniqueOrThrow({ where: { id: b.id } })).notes).toBe("updated");
  });

  it("Plant, Study, Scenario", async () => {
    const fuel = await db.fuel.create({ data: { name: "NG", kind: "gas", definition: "{}" } });
    const quote = await db.priceQuote.create({
      data: { fuelId: fuel.id, amount: 1, currency: "EUR", unit: "MWh", energyBasis: "gross", validFrom: new Date() },
    });
    const plant = await db.plant.create({
      data: {
        name: "P",
        site: "S",
        equipmentType: "steam-boiler",
        ratedInput_kW: 1000,
        ratedInputBasis: "gross",
        annualUsefulHeat_MWh: 5000,
        operatingHours: 8000,
        averageLoadFraction: 0.6,
        baselineFuelId: fuel.id,
        stackTemperatureC: 150,
        flueO2DryPercent: 3,
        combustionAirC: 20,
        radiationLossPercent: 1,
        condensing: true,
        returnWaterC: 40,
        condensingApproachK: 4,
        flueCODryPpm: 120,
        unburntCarbonInAshPercent: 8,
        ambientAirTemperatureC: 10,
        ambientAirRelativeHumidityPercent: 70,
        wobbeTolerancePercent: null,
        wobbeMin_MJ_per_m3: 47.2,
        wobbeMax_MJ_per_m3: 51.41,
        wobbeMeteringReference: "15C",
        wobbeCombustionReferenceC: 15,
        maxFlameTempRiseK: 50,
        flueGasCapacity_m3_per_h: 2000,
        flueGasCapacityBasis: "normal",
        airCapacity_m3_per_h: 1800,
        airCapacityBasis: "actual",
        fuelSupplyCapacity_m3_per_h: 120,
        fuelSupplyMeteringReference: "0C",
        maxH2SharePercent: 20,
        warnAtFractionOfLimit: 0.85,
        dewPointMarginK: 15,
        burnerType: "premixed",
        burnerAirControl: "o2-trim",
        burnerFlashbackWarnRatio: 1.1,
        burnerFlashbackFailRatio: 1.4,
        burnerRegulatedSupply: false,
        noxLimit_mg_per_m3: 100,
        noxReferenceO2Percent: 3,
        noxMeasuredBaseline_mg_per_m3: 70,
        so2Limit_mg_per_m3: 35,
        gasBurnerPressure_kPa: 2.2,
        gasSupplyPressure_kPa: 3,
        liquidTrain: '{"flowCapacity":1200}',
        notes: "n",
        isDemo: false,
      },
    });
    const readPlant = await db.plant.findUniqueOrThrow({ where: { id: plant.id } });
    expect(readPlant).toMatchObject({
      burnerType: "premixed",
      burnerAirControl: "o2-trim",
      burnerFlashbackWarnRatio: 1.1,
      burnerFlashbackFailRatio: 1.4,
      burnerRegulatedSupply: false,
      noxLimit_mg_per_m3: 100,
      noxReferenceO2Percent: 3,
      noxMeasuredBaseline_mg_per_m3: 70,
      so2Limit_mg_per_m3: 35,
      gasBurnerPressure_kPa: 2.2,
      gasSupplyPressure_kPa: 3,
      liquidTrain: '{"flowCapacity":1200}',
      wobbeMin_MJ_per_m3: 47.2,
      condensing: true,
      returnWaterC: 40,
      condensingApproachK: 4,
      flueCODryPpm: 120,
      unburntCarbonInAshPercent: 8,
      warnAtFractionOfLimit: 0.85,
      flueGasCapacityBasis: "normal",
    });
    const study = await db.study.create({
      data: {
        plantId: plant.id,
        name: "S1",
        carbonPrice_per_t: 80,
        currency: "EUR",
        discountRatePercent: 8,
        horizonYears: 15,
        priceEscalationPercent: 2,
        rankingMetric: "npv",
        includeUpstream: true,
        sensitivityRanges: '{"fuelPricePercent":25}',
        notes: "",
        reportTitle: "T",
        preparedFor: "Client Ltd",
        preparedBy: "A. Consultant",
        reportDate: "2026-11-30",
        reportNotes: "Scope.",
      },
    });
    expect(await db.study.findUniqueOrThrow({ where: { id: study.id } })).toMatchObject({
      includeUpstream: true,
      sensitivityRanges: '{"fuelPricePercent":25}',
      reportTitle: "T",
      preparedFor: "Client Ltd",
      preparedBy: "A. Consultant",
      reportDate: "2026-11-30",
      reportNotes: "Scope.",
    });
    const bare = await db.study.create({
      data: { plantId: plant.id, name: "S0", currency: "EUR", discountRatePercent: 8, horizonYears: 15, rankingMetric: "npv" },
    });
    expect(bare).toMatchObject({ reportTitle: "", preparedFor: "", preparedBy: "", reportDate: null, reportNotes: "" });
    await db.study.delete({ where: { id: bare.id } });
    const sc = await db.scenario.create({
      data: {
        studyId: study.id,
        name: "base",
        fuelId: fuel.id,
        priceQuoteId: quote.id,
        capex: 1e5,
        fixedOpexChange: -500,
        overrides: '{"stackTemperatureC":120}',
        isBaseline: true,
        position: 0,
      },
    });
    expect(JSON.parse((await db.scenario.findUniqueOrThrow({ where: { id: sc.id } })).overrides)).toEqual({ stackTemperatureC: 120 });
    await expect(db.scenario.create({ data: { studyId: study.id, name: "base", fuelId: fuel.id } })).rejects.toThrow();
    // A fuel used by a scenario cannot be deleted (Restrict).
    await expect(db.fuel.delete({ where: { id: fuel.id } })).rejects.toThrow();
    // Deleting a quote leaves the scenario without one (SetNull).
    await db.priceQuote.delete({ where: { id: quote.id } });
    expect((await db.scenario.findUniqueOrThrow({ where: { id: sc.id } })).priceQuoteId).toBeNull();
    await db.study.update({ where: { id: study.id }, data: { rankingMetric: "co2-per-useful-MJ" } });
    // Deleting the plant deletes its studies and their scenarios (Cascade).
    await db.plant.delete({ where: { id: plant.id } });
    expect(await db.study.count()).toBe(0);
    expect(await db.scenario.count()).toBe(0);
    await db.fuel.delete({ where: { id: fuel.id } });
  });

  it("quote versions, ExchangeRate, StudyRevision, RevisionQuote, Scenario.priceValidOn", async () => {
    const fuel = await db.fuel.create({ data: { name: "NG2", kind: "gas", definition: "{}" } });
    const q1 = await db.priceQuote.create({
      data: {
        fuelId: fuel.id,
        amount: 30,
        currency: "EUR",
        unit: "MWh",
        energyBasis: "gross",
        validFrom: new Date("2026-01-01T00:00:00Z"),
      },
    });
    const withdrawnAt = new Date("2026-03-01T10:00:00Z");
    const q2 = await db.priceQuote.create({
      data: {
        fuelId: fuel.id,
        amount: 31,
        currency: "EUR",
        unit: "MWh",
        energyBasis: "gross",
        validFrom: new Date("2026-01-01T00:00:00Z"),
        supersedesId: q1.id,
        withdrawnAt,
        supplier: "Gas Co",
      },
    });
    expect(await db.priceQuote.findUniqueOrThrow({ where: { id: q2.id } })).toMatchObject({
      supersedesId: q1.id,
      withdrawnAt,
      supplier: "Gas Co",
    });
    expect((await db.priceQuote.findUniqueOrThrow({ where: { id: q1.id } })).supplier).toBe("");
    expect(
      (await db.priceQuote.findUniqueOrThrow({ where: { id: q1.id }, include: { supersededBy: true } })).supersededBy.map((q) => q.id),
    ).toEqual([q2.id]);
    // A quote that a later version supersedes cannot be deleted (Restrict).
    await expect(db.priceQuote.delete({ where: { id: q1.id } })).rejects.toThrow();

    const rateDate = new Date("2026-02-02T00:00:00Z");
    const rate = await db.exchangeRate.create({
      data: { fromCurrency: "GBP", toCurrency: "EUR", rate: 1.1612, validFrom: rateDate, source: "test" },
    });
    expect(await db.exchangeRate.findUniqueOrThrow({ where: { id: rate.id } })).toMatchObject({
      fromCurrency: "GBP",
      toCurrency: "EUR",
      rate: 1.1612,
      validFrom: rateDate,
      source: "test",
    });
    await expect(
      db.exchangeRate.create({ data: { fromCurrency: "GBP", toCurrency: "EUR", rate: 1.2, validFrom: rateDate } }),
    ).rejects.toThrow();

    const plant = await db.plant.create({
      data: {
        name: "P2",
        equipmentType: "steam-boiler",
        ratedInput_kW: 1000,
        operatingHours: 8000,
        averageLoadFraction: 0.6,
        stackTemperatureC: 150,
        flueO2DryPercent: 3,
        combustionAirC: 20,
        radiationLossPercent: 1,
      },
    });
    const study = await db.study.create({
      data: { plantId: plant.id, name: "S2", currency: "EUR", discountRatePercent: 8, horizonYears: 15, rankingMetric: "npv" },
    });
    const on = new Date("2026-02-15T00:00:00Z");
    const sc = await db.scenario.create({ data: { studyId: study.id, name: "base", fuelId: fuel.id, priceValidOn: on, isBaseline: true } });
    expect((await db.scenario.findUniqueOrThrow({ where: { id: sc.id } })).priceValidOn).toEqual(on);
    const rev = await db.studyRevision.create({
      data: { studyId: study.id, number: 1, hash: "ab", inputs: "{}", results: "[]", meta: '{"m":1}' },
    });
    expect(await db.studyRevision.findUniqueOrThrow({ where: { id: rev.id } })).toMatchObject({
      studyId: study.id,
      number: 1,
      hash: "ab",
      inputs: "{}",
      results: "[]",
      meta: '{"m":1}',
    });
    await expect(
      db.studyRevision.create({ data: { studyId: study.id, number: 1, hash: "cd", inputs: "{}", results: "[]", meta: "{}" } }),
    ).rejects.toThrow();
    await db.revisionQuote.create({ data: { revisionId: rev.id, quoteId: q2.id } });
    expect(await db.revisionQuote.findMany({ where: { quoteId: q2.id } })).toEqual([{ revisionId: rev.id, quoteId: q2.id }]);
    // A quote an issued revision used cannot be deleted, nor can a study with revisions (Restrict).
    await expect(db.priceQuote.delete({ where: { id: q2.id } })).rejects.toThrow();
    await expect(db.study.delete({ where: { id: study.id } })).rejects.toThrow();
    // Deleting the revision deletes its quote links (Cascade).
    await db.studyRevision.delete({ where: { id: rev.id } });
    expect(await db.revisionQuote.count()).toBe(0);
    await db.study.delete({ where: { id: study.id } });
  });

  it("trash columns, Account, Session, ApiToken, ChangeLog", async () => {
    const when = new Date("2026-12-02T09:20:00Z");
    const f = await db.fuel.create({ data: { name: "Trashed", kind: "gas", definition: "{}", deletedAt: when, deletedBy: "a@b.c" } });
    expect(f).toMatchObject({ deletedAt: when, deletedBy: "a@b.c" });
    const p = await db.plant.create({
      data: {
        name: "Trashed plant",
        equipmentType: "steam-boiler",
        ratedInput_kW: 1,
        operatingHours: 1,
        averageLoadFraction: 1,
        stackTemperatureC: 1,
        flueO2DryPercent: 1,
        combustionAirC: 1,
        radiationLossPercent: 1,
        deletedAt: when,
        deletedBy: "x",
      },
    });
    expect(p.deletedAt?.toISOString()).toBe(when.toISOString());
    const s = await db.study.create({
      data: { plantId: p.id, name: "S", currency: "EUR", discountRatePercent: 1, horizonYears: 1, rankingMetric: "npv", deletedAt: when },
    });
    expect(s.deletedAt?.toISOString()).toBe(when.toISOString());
    expect(s.deletedBy).toBeNull();

    const a = await db.account.create({ data: { email: "a@example.org", role: "admin", passwordHash: "$argon2id$x" } });
    expect(a).toMatchObject({ displayName: "", version: 1, disabledAt: null, failedSignIns: 0, lockedUntil: null, lastSignInAt: null });
    await expect(db.account.create({ data: { email: "a@example.org", role: "viewer", passwordHash: "y" } })).rejects.toThrow();
    await db.account.update({
      where: { id: a.id },
      data: { version: 2, disabledAt: when, failedSignIns: 3, lockedUntil: when, lastSignInAt: when },
    });
    expect(await db.account.findUniqueOrThrow({ where: { id: a.id } })).toMatchObject({ version: 2, failedSignIns: 3, lockedUntil: when });
    const sess = await db.session.create({ data: { keyHash: "k1", accountId: a.id, accountVersion: 2, expiresAt: when } });
    expect(sess.createdAt).toBeInstanceOf(Date);
    await expect(db.session.create({ data: { keyHash: "k1", accountId: a.id, accountVersion: 2, expiresAt: when } })).rejects.toThrow();
    const tok = await db.apiToken.create({ data: { accountId: a.id, name: "ci", tokenHash: "t1", prefix: "stk_ab", expiresAt: when } });
    expect(tok.lastUsedAt).toBeNull();
    expect(tok.expiresAt).toEqual(when);
    await db.apiToken.update({ where: { id: tok.id }, data: { lastUsedAt: when } });
    const log = await db.changeLog.create({
      data: {
        actor: "a@example.org",
        accountId: a.id,
        subjectType: "fuel",
        subjectId: 1,
        entity: "quote",
        entityId: 2,
        action: "update",
        before: "{}",
        after: '{"x":1}',
      },
    });
    expect(log).toMatchObject({ summary: "", before: "{}", after: '{"x":1}' });
    expect(log.at).toBeInstanceOf(Date);
    // Deleting an account deletes its sessions and tokens (Cascade); the change log keeps its lines.
    await db.account.delete({ where: { id: a.id } });
    expect(await db.session.count()).toBe(0);
    expect(await db.apiToken.count()).toBe(0);
    expect(await db.changeLog.count()).toBe(1);
  });

  it("Study.hydrogenFuelId, UncertaintyRun", async () => {
    const h2 = await db.fuel.create({ data: { name: "H2 crud", kind: "gas", definition: '{"composition":{"H2":1}}' } });
    const plant = await db.plant.create({
      data: {
        name: "P3",
        equipmentType: "steam-boiler",
        ratedInput_kW: 1000,
        operatingHours: 8000,
        averageLoadFraction: 0.6,
        stackTemperatureC: 150,
        flueO2DryPercent: 3,
        combustionAirC: 20,
        radiationLossPercent: 1,
      },
    });
    const study = await db.study.create({
      data: {
        plantId: plant.id,
        name: "S3",
        currency: "EUR",
        discountRatePercent: 8,
        horizonYears: 15,
        rankingMetric: "npv",
        hydrogenFuelId: h2.id,
      },
    });
    expect((await db.study.findUniqueOrThrow({ where: { id: study.id } })).hydrogenFuelId).toBe(h2.id);
    // A fuel a study names as its hydrogen cannot be deleted (Restrict).
    await expect(db.fuel.delete({ where: { id: h2.id } })).rejects.toThrow();
    const run = await db.uncertaintyRun.create({ data: { studyId: study.id, inputsHash: "ab", settings: '{"draws":100}', results: "{}" } });
    expect(await db.uncertaintyRun.findUniqueOrThrow({ where: { id: run.id } })).toMatchObject({
      studyId: study.id,
      inputsHash: "ab",
      settings: '{"draws":100}',
      results: "{}",
    });
    expect((await db.uncertaintyRun.findUniqueOrThrow({ where: { id: run.id } })).createdAt).toBeInstanceOf(Date);
    // Deleting the study deletes its stored runs (Cascade); then the fuel is free.
    await db.study.delete({ where: { id: study.id } });
    expect(await db.uncertaintyRun.count()).toBe(0);
    await db.fuel.delete({ where: { id: h2.id } });
    await db.plant.delete({ where: { id: plant.id } });
  });

  it("FlameSolve: one row per key, written once", async () => {
    const row = await db.flameSolve.create({
      data: { key: "k1", request: '{"phi":0.9}', result: '{"burningVelocity_cm_per_s":30}', cpuSeconds: 6.5 },
    });
    expect(await db.flameSolve.findUniqueOrThrow({ where: { key: "k1" } })).toMatchObject({
      request: '{"phi":0.9}',
      result: '{"burningVelocity_cm_per_s":30}',
      error: null,
      cpuSeconds: 6.5,
    });
    expect(row.createdAt).toBeInstanceOf(Date);
    await db.flameSolve.create({ data: { key: "k2", request: "{}", error: "did not converge" } });
    expect((await db.flameSolve.findUniqueOrThrow({ where: { key: "k2" } })).result).toBeNull();
    await expect(db.flameSolve.create({ data: { key: "k1", request: "{}" } })).rejects.toThrow();
  });
});
