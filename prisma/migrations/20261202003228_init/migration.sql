-- CreateTable
CREATE TABLE "Fuel" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "name" TEXT NOT NULL,
    "kind" TEXT NOT NULL,
    "definition" TEXT NOT NULL,
    "densityKgPerM3" REAL,
    "biogenicCarbonShare" REAL NOT NULL DEFAULT 0,
    "upstreamCo2e_kg_per_GJ" REAL,
    "notes" TEXT NOT NULL DEFAULT '',
    "source" TEXT NOT NULL DEFAULT '',
    "isDemo" BOOLEAN NOT NULL DEFAULT false,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" DATETIME NOT NULL
);

-- CreateTable
CREATE TABLE "BlendComponent" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "blendFuelId" INTEGER NOT NULL,
    "componentFuelId" INTEGER NOT NULL,
    "share" REAL NOT NULL,
    "basis" TEXT NOT NULL,
    "position" INTEGER NOT NULL DEFAULT 0,
    CONSTRAINT "BlendComponent_blendFuelId_fkey" FOREIGN KEY ("blendFuelId") REFERENCES "Fuel" ("id") ON DELETE CASCADE ON UPDATE CASCADE,
    CONSTRAINT "BlendComponent_componentFuelId_fkey" FOREIGN KEY ("componentFuelId") REFERENCES "Fuel" ("id") ON DELETE RESTRICT ON UPDATE CASCADE
);

-- CreateTable
CREATE TABLE "PriceQuote" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "fuelId" INTEGER NOT NULL,
    "amount" REAL NOT NULL,
    "currency" TEXT NOT NULL,
    "unit" TEXT NOT NULL,
    "energyBasis" TEXT,
    "meteringReference" TEXT,
    "transportAdder" REAL NOT NULL DEFAULT 0,
    "handlingAdder" REAL NOT NULL DEFAULT 0,
    "validFrom" DATETIME NOT NULL,
    "sourceNote" TEXT NOT NULL DEFAULT '',
    "isInvented" BOOLEAN NOT NULL DEFAULT false,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
    CONSTRAINT "PriceQuote_fuelId_fkey" FOREIGN KEY ("fuelId") REFERENCES "Fuel" ("id") ON DELETE CASCADE ON UPDATE CASCADE
);

-- CreateTable
CREATE TABLE "Plant" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "name" TEXT NOT NULL,
    "site" TEXT NOT NULL DEFAULT '',
    "equipmentType" TEXT NOT NULL,
    "ratedInput_kW" REAL NOT NULL,
    "ratedInputBasis" TEXT NOT NULL DEFAULT 'net',
    "annualUsefulHeat_MWh" REAL,
    "operatingHours" REAL NOT NULL,
    "averageLoadFraction" REAL NOT NULL,
    "baselineFuelId" INTEGER,
    "stackTemperatureC" REAL NOT NULL,
    "flueO2DryPercent" REAL NOT NULL,
    "combustionAirC" REAL NOT NULL,
    "radiationLossPercent" REAL NOT NULL,
    "condensing" BOOLEAN NOT NULL DEFAULT false,
    "returnWaterC" REAL,
    "ambientAirTemperatureC" REAL NOT NULL DEFAULT 15,
    "ambientAirRelativeHumidityPercent" REAL NOT NULL DEFAULT 60,
    "wobbeTolerancePercent" REAL,
    "wobbeMin_MJ_per_m3" REAL,
    "wobbeMax_MJ_per_m3" REAL,
    "wobbeMeteringReference" TEXT NOT NULL DEFAULT '15C',
    "wobbeCombustionReferenceC" REAL NOT NULL DEFAULT 15,
    "maxFlameTempRiseK" REAL,
    "flueGasCapacity_m3_per_h" REAL,
    "flueGasCapacityBasis" TEXT NOT NULL DEFAULT 'actual',
    "airCapacity_m3_per_h" REAL,
    "airCapacityBasis" TEXT NOT NULL DEFAULT 'actual',
    "fuelSupplyCapacity_m3_per_h" REAL,
    "fuelSupplyMeteringReference" TEXT NOT NULL DEFAULT '0C',
    "maxH2SharePercent" REAL,
    "warnAtFractionOfLimit" REAL NOT NULL DEFAULT 0.9,
    "dewPointMarginK" REAL NOT NULL DEFAULT 10,
    "notes" TEXT NOT NULL DEFAULT '',
    "isDemo" BOOLEAN NOT NULL DEFAULT false,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" DATETIME NOT NULL,
    CONSTRAINT "Plant_baselineFuelId_fkey" FOREIGN KEY ("baselineFuelId") REFERENCES "Fuel" ("id") ON DELETE SET NULL ON UPDATE CASCADE
);

-- CreateTable
CREATE TABLE "Study" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "plantId" INTEGER NOT NULL,
    "name" TEXT NOT NULL,
    "carbonPrice_per_t" REAL NOT NULL DEFAULT 0,
    "currency" TEXT NOT NULL,
    "discountRatePercent" REAL NOT NULL,
    "horizonYears" INTEGER NOT NULL,
    "priceEscalationPercent" REAL NOT NULL DEFAULT 0,
    "rankingMetric" TEXT NOT NULL,
    "notes" TEXT NOT NULL DEFAULT '',
    "isDemo" BOOLEAN NOT NULL DEFAULT false,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" DATETIME NOT NULL,
    CONSTRAINT "Study_plantId_fkey" FOREIGN KEY ("plantId") REFERENCES "Plant" ("id") ON DELETE CASCADE ON UPDATE CASCADE
);

-- CreateTable
CREATE TABLE "Scenario" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "studyId" INTEGER NOT NULL,
    "name" TEXT NOT NULL,
    "fuelId" INTEGER NOT NULL,
    "priceQuoteId" INTEGER,
    "capex" REAL NOT NULL DEFAULT 0,
    "fixedOpexChange" REAL NOT NULL DEFAULT 0,
    "overrides" TEXT NOT NULL DEFAULT '{}',
    "isBaseline" BOOLEAN NOT NULL DEFAULT false,
    "position" INTEGER NOT NULL DEFAULT 0,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" DATETIME NOT NULL,
    CONSTRAINT "Scenario_studyId_fkey" FOREIGN KEY ("studyId") REFERENCES "Study" ("id") ON DELETE CASCADE ON UPDATE CASCADE,
    CONSTRAINT "Scenario_fuelId_fkey" FOREIGN KEY ("fuelId") REFERENCES "Fuel" ("id") ON DELETE RESTRICT ON UPDATE CASCADE,
    CONSTRAINT "Scenario_priceQuoteId_fkey" FOREIGN KEY ("priceQuoteId") REFERENCES "PriceQuote" ("id") ON DELETE SET NULL ON UPDATE CASCADE
);

-- CreateIndex
CREATE UNIQUE INDEX "Fuel_name_key" ON "Fuel"("name");

-- CreateIndex
CREATE INDEX "BlendComponent_componentFuelId_idx" ON "BlendComponent"("componentFuelId");

-- CreateIndex
CREATE UNIQUE INDEX "BlendComponent_blendFuelId_componentFuelId_key" ON "BlendComponent"("blendFuelId", "componentFuelId");

-- CreateIndex
CREATE INDEX "PriceQuote_fuelId_validFrom_idx" ON "PriceQuote"("fuelId", "validFrom");

-- CreateIndex
CREATE UNIQUE INDEX "Plant_name_key" ON "Plant"("name");

-- CreateIndex
CREATE INDEX "Plant_baselineFuelId_idx" ON "Plant"("baselineFuelId");

-- CreateIndex
CREATE UNIQUE INDEX "Study_plantId_name_key" ON "Study"("plantId", "name");

-- CreateIndex
CREATE INDEX "Scenario_fuelId_idx" ON "Scenario"("fuelId");

-- CreateIndex
CREATE INDEX "Scenario_priceQuoteId_idx" ON "Scenario"("priceQuoteId");

-- CreateIndex
CREATE UNIQUE INDEX "Scenario_studyId_name_key" ON "Scenario"("studyId", "name");

