-- CreateTable
CREATE TABLE "UncertaintyRun" (
    "id" INTEGER NOT NULL PRIMARY KEY AUTOINCREMENT,
    "studyId" INTEGER NOT NULL,
    "inputsHash" TEXT NOT NULL,
    "settings" TEXT NOT NULL,
    "results" TEXT NOT NULL,
    "createdAt" DATETIME NOT NULL DEFAULT CURRENT_TIMESTAMP,
    CONSTRAINT "UncertaintyRun_studyId_fkey" FOREIGN KEY ("studyId") REFERENCES "Study" ("id") ON DELETE CASCADE ON UPDATE CASCADE
);

-- CreateIndex
CREATE INDEX "UncertaintyRun_studyId_inputsHash_idx" ON "UncertaintyRun"("studyId", "inputsHash");
