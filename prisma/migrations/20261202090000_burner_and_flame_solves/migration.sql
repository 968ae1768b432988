-- AlterTable
ALTER TABLE "Plant" ADD COLUMN "burnerType" TEXT;
ALTER TABLE "Plant" ADD COLUMN "burnerAirControl" TEXT;
ALTER TABLE "Plant" ADD COLUMN "burnerFlashbackWarnRatio" REAL;
ALTER TABLE "Plant" ADD COLUMN "burnerFlashbackFailRatio" REAL;
ALTER TABLE "Plant" ADD COLUMN "burnerRegulatedSupply" BOOLEAN;
ALTER TABLE "Plant" ADD COLUMN "noxLimit_mg_per_m3" REAL;
ALTER TABLE "Plant" ADD COLUMN "noxReferenceO2Percent" REAL;
ALTER TABLE "Plant" ADD COLUMN "noxMeasuredBaseline_mg_per_m3" REAL;
ALTER TABLE "Plant" ADD COLUMN "so2Limit_mg_per_m3" REAL;
ALTER TABLE "Plant" ADD COLUMN "gasBurnerPressure_kPa" REAL;
ALTER TABLE "Plant" ADD COLUMN "gasSupplyPressure_kPa" REAL;
ALTER TABLE "Plant" ADD COLUMN "liquidTrain" TEXT;

-- CreateTable
CREATE TABLE "FlameSolve" (
    "key" TEXT NOT NULL PRIMARY KEY,
    "request" TEXT NOT NULL,
    "result" TEXT,
    "error" TEXT,
    "cpuSeconds" REAL,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP
);
