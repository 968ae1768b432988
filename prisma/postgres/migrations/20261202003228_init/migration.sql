-- CreateTable
CREATE TABLE "Fuel" (
    "id" SERIAL NOT NULL,
    "name" TEXT NOT NULL,
    "kind" TEXT NOT NULL,
    "definition" TEXT NOT NULL,
    "densityKgPerM3" DOUBLE PRECISION,
    "biogenicCarbonShare" DOUBLE PRECISION NOT NULL DEFAULT 0,
    "upstreamCo2e_kg_per_GJ" DOUBLE PRECISION,
    "notes" TEXT NOT NULL DEFAULT '',
    "source" TEXT NOT NULL DEFAULT '',
    "isDemo" BOOLEAN NOT NULL DEFAULT false,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Fuel_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "BlendComponent" (
    "id" SERIAL NOT NULL,
    "blendFuelId" INTEGER NOT NULL,
    "componentFuelId" INTEGER NOT NULL,
    "share" DOUBLE PRECISION NOT NULL,
    "basis" TEXT NOT NULL,
    "position" INTEGER NOT NULL DEFAULT 0,

    CONSTRAINT "BlendComponent_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "PriceQuote" (
    "id" SERIAL NOT NULL,
    "fuelId" INTEGER NOT NULL,
    "amount" DOUBLE PRECISION NOT NULL,
    "currency" TEXT NOT NULL,
    "unit" TEXT NOT NULL,
    "energyBasis" TEXT,
    "meteringReference" TEXT,
    "transportAdder" DOUBLE PRECISION NOT NULL DEFAULT 0,
    "handlingAdder" DOUBLE PRECISION NOT NULL DEFAULT 0,
    "validFrom" TIMESTAMP(3) NOT NULL,
    "sourceNote" TEXT NOT NULL DEFAULT '',
    "isInvented" BOOLEAN NOT NULL DEFAULT false,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "PriceQuote_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Plant" (
    "id" SERIAL NOT NULL,
    "name" TEXT NOT NULL,
    "site" TEXT NOT NULL DEFAULT '',
    "equipmentType" TEXT NOT NULL,
    "ratedInput_kW" DOUBLE PRECISION NOT NULL,
    "ratedInputBasis" TEXT NOT NULL DEFAULT 'net',
    "annualUsefulHeat_MWh" DOUBLE PRECISION,
    "operatingHours" DOUBLE PRECISION NOT NULL,
    "averageLoadFraction" DOUBLE PRECISION NOT NULL,
    "baselineFuelId" INTEGER,
    "stackTemperatureC" DOUBLE PRECISION NOT NULL,
    "flueO2DryPercent" DOUBLE PRECISION NOT NULL,
    "combustionAirC" DOUBLE PRECISION NOT NULL,
    "radiationLossPercent" DOUBLE PRECISION NOT NULL,
    "condensing" BOOLEAN NOT NULL DEFAULT false,
    "returnWaterC" DOUBLE PRECISION,
    "ambientAirTemperatureC" DOUBLE PRECISION NOT NULL DEFAULT 15,
    "ambientAirRelativeHumidityPercent" DOUBLE PRECISION NOT NULL DEFAULT 60,
    "wobbeTolerancePercent" DOUBLE PRECISION,
    "wobbeMin_MJ_per_m3" DOUBLE PRECISION,
    "wobbeMax_MJ_per_m3" DOUBLE PRECISION,
    "wobbeMeteringReference" TEXT NOT NULL DEFAULT '15C',
    "wobbeCombustionReferenceC" DOUBLE PRECISION NOT NULL DEFAULT 15,
    "maxFlameTempRiseK" DOUBLE PRECISION,
    "flueGasCapacity_m3_per_h" DOUBLE PRECISION,
    "flueGasCapacityBasis" TEXT NOT NULL DEFAULT 'actual',
    "airCapacity_m3_per_h" DOUBLE PRECISION,
    "airCapacityBasis" TEXT NOT NULL DEFAULT 'actual',
    "fuelSupplyCapacity_m3_per_h" DOUBLE PRECISION,
    "fuelSupplyMeteringReference" TEXT NOT NULL DEFAULT '0C',
    "maxH2SharePercent" DOUBLE PRECISION,
    "warnAtFractionOfLimit" DOUBLE PRECISION NOT NULL DEFAULT 0.9,
    "dewPointMarginK" DOUBLE PRECISION NOT NULL DEFAULT 10,
    "notes" TEXT NOT NULL DEFAULT '',
    "isDemo" BOOLEAN NOT NULL DEFAULT false,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Plant_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Study" (
    "id" SERIAL NOT NULL,
    "plantId" INTEGER NOT NULL,
    "name" TEXT NOT NULL,
    "carbonPrice_per_t" DOUBLE PRECISION NOT NULL DEFAULT 0,
    "currency" TEXT NOT NULL,
    "discountRatePercent" DOUBLE PRECISION NOT NULL,
    "horizonYears" INTEGER NOT NULL,
    "priceEscalationPercent" DOUBLE PRECISION NOT NULL DEFAULT 0,
    "rankingMetric" TEXT NOT NULL,
    "notes" TEXT NOT NULL DEFAULT '',
    "isDemo" BOOLEAN NOT NULL DEFAULT false,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Study_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Scenario" (
    "id" SERIAL NOT NULL,
    "studyId" INTEGER NOT NULL,
    "name" TEXT NOT NULL,
    "fuelId" INTEGER NOT NULL,
    "priceQuoteId" INTEGER,
    "capex" DOUBLE PRECISION NOT NULL DEFAULT 0,
    "fixedOpexChange" DOUBLE PRECISION NOT NULL DEFAULT 0,
    "overrides" TEXT NOT NULL DEFAULT '{}',
    "isBaseline" BOOLEAN NOT NULL DEFAULT false,
    "position" INTEGER NOT NULL DEFAULT 0,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Scenario_pkey" PRIMARY KEY ("id")
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

-- AddForeignKey
ALTER TABLE "BlendComponent" ADD CONSTRAINT "BlendComponent_blendFuelId_fkey" FOREIGN KEY ("blendFuelId") REFERENCES "Fuel"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "BlendComponent" ADD CONSTRAINT "BlendComponent_componentFuelId_fkey" FOREIGN KEY ("componentFuelId") REFERENCES "Fuel"("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "PriceQuote" ADD CONSTRAINT "PriceQuote_fuelId_fkey" FOREIGN KEY ("fuelId") REFERENCES "Fuel"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Plant" ADD CONSTRAINT "Plant_baselineFuelId_fkey" FOREIGN KEY ("baselineFuelId") REFERENCES "Fuel"("id") ON DELETE SET NULL ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Study" ADD CONSTRAINT "Study_plantId_fkey" FOREIGN KEY ("plantId") REFERENCES "Plant"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Scenario" ADD CONSTRAINT "Scenario_studyId_fkey" FOREIGN KEY ("studyId") REFERENCES "Study"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Scenario" ADD CONSTRAINT "Scenario_fuelId_fkey" FOREIGN KEY ("fuelId") REFERENCES "Fuel"("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Scenario" ADD CONSTRAINT "Scenario_priceQuoteId_fkey" FOREIGN KEY ("priceQuoteId") REFERENCES "PriceQuote"("id") ON DELETE SET NULL ON UPDATE CASCADE;
