-- CreateTable
CREATE TABLE "UncertaintyRun" (
    "id" SERIAL NOT NULL,
    "studyId" INTEGER NOT NULL,
    "inputsHash" TEXT NOT NULL,
    "settings" TEXT NOT NULL,
    "results" TEXT NOT NULL,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "UncertaintyRun_pkey" PRIMARY KEY ("id")
);

-- CreateIndex
CREATE INDEX "UncertaintyRun_studyId_inputsHash_idx" ON "UncertaintyRun"("studyId", "inputsHash");

-- AddForeignKey
ALTER TABLE "UncertaintyRun" ADD CONSTRAINT "UncertaintyRun_studyId_fkey" FOREIGN KEY ("studyId") REFERENCES "Study"("id") ON DELETE CASCADE ON UPDATE CASCADE;
