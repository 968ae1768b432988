-- AlterTable: the study names the hydrogen its sweep blends
ALTER TABLE "Study" ADD COLUMN "hydrogenFuelId" INTEGER REFERENCES "Fuel" ("id") ON DELETE RESTRICT ON UPDATE CASCADE;

-- CreateIndex
CREATE INDEX "Study_hydrogenFuelId_idx" ON "Study"("hydrogenFuelId");

-- Existing studies keep the hydrogen they were swept with: the library's first pure hydrogen
-- (a gas whose composition names H2 alone), as the sweep chose it before this column existed.
UPDATE "Study" SET "hydrogenFuelId" = (
    SELECT f."id" FROM "Fuel" f
    WHERE f."kind" = 'gas'
      AND json_valid(f."definition")
      AND json_type(f."definition", '$.composition.H2') IS NOT NULL
      AND (SELECT count(*) FROM json_each(f."definition", '$.composition')) = 1
    ORDER BY f."id" LIMIT 1
);
