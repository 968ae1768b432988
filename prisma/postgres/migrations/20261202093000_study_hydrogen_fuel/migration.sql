-- AlterTable: the study names the hydrogen its sweep blends
ALTER TABLE "Study" ADD COLUMN "hydrogenFuelId" INTEGER;

-- AddForeignKey
ALTER TABLE "Study" ADD CONSTRAINT "Study_hydrogenFuelId_fkey" FOREIGN KEY ("hydrogenFuelId") REFERENCES "Fuel"("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- CreateIndex
CREATE INDEX "Study_hydrogenFuelId_idx" ON "Study"("hydrogenFuelId");

-- Existing studies keep the hydrogen they were swept with: the library's first pure hydrogen
-- (a gas whose composition names H2 alone), as the sweep chose it before this column existed.
UPDATE "Study" SET "hydrogenFuelId" = (
    SELECT f."id" FROM "Fuel" f
    WHERE f."kind" = 'gas'
      AND f."definition" LIKE '{%'
      AND jsonb_typeof(f."definition"::jsonb -> 'composition' -> 'H2') IS NOT NULL
      AND (SELECT count(*) FROM jsonb_object_keys(f."definition"::jsonb -> 'composition')) = 1
    ORDER BY f."id" LIMIT 1
);
