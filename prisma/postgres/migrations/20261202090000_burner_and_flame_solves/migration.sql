-- AlterTable
ALTER TABLE "Plant" ADD COLUMN "burnerType" TEXT;
ALTER TABLE "Plant" ADD COLUMN "burnerAirControl" TEXT;
ALTER TABLE "Plant" ADD COLUMN "burnerFlashbackWarnRatio" DOUBLE PRECISION;
ALTER TABLE "Plant" ADD COLUMN "burnerFlashbackFailRatio" DOUBLE PRECISION;
ALTER TABLE "Plant" ADD COLUMN "burnerRegulatedSupply" BOOLEAN;
ALTER TABLE "Plant" ADD COLUMN "noxLimit_mg_per_m3" DOUBLE PRECISION;
ALTER TABLE "Plant" ADD COLUMN "noxReferenceO2Percent" DOUBLE PRECISION;
ALTER TABLE "Plant" ADD COLUMN "noxMeasuredBaseline_mg_per_m3" DOUBLE PRECISION;
ALTER TABLE "Plant" ADD COLUMN "so2Limit_mg_per_m3" DOUBLE PRECISION;
ALTER TABLE "Plant" ADD COLUMN "gasBurnerPressure_kPa" DOUBLE PRECISION;
ALTER TABLE "Plant" ADD COLUMN "gasSupplyPressure_kPa" DOUBLE PRECISION;
ALTER TABLE "Plant" ADD COLUMN "liquidTrain" TEXT;

-- CreateTable
CREATE TABLE "FlameSolve" (
    "key" TEXT NOT NULL,
    "request" TEXT NOT NULL,
    "result" TEXT,
    "error" TEXT,
    "cpuSeconds" DOUBLE PRECISION,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "FlameSolve_pkey" PRIMARY KEY ("key")
);
