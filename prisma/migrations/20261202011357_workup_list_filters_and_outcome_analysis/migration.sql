-- DropIndex
DROP INDEX "Workup_groupId_chemistId_idx";

-- DropIndex
DROP INDEX "Workup_groupId_flagged_idx";

-- AlterTable
ALTER TABLE "Outcome" ADD COLUMN     "analysis" JSONB NOT NULL DEFAULT '{}';

-- AlterTable
ALTER TABLE "Workup" ADD COLUMN     "solventKeys" TEXT[] DEFAULT ARRAY[]::TEXT[];

-- CreateIndex
CREATE INDEX "Workup_groupId_chemistId_performedOn_id_idx" ON "Workup"("groupId", "chemistId", "performedOn" DESC, "id");

-- CreateIndex
CREATE INDEX "Workup_groupId_flagged_performedOn_id_idx" ON "Workup"("groupId", "flagged", "performedOn" DESC, "id");

-- CreateIndex
CREATE INDEX "Workup_solventKeys_idx" ON "Workup" USING GIN ("solventKeys");
