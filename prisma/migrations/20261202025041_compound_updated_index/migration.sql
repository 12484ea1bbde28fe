-- CreateIndex
CREATE INDEX "Compound_groupId_updatedAt_idx" ON "Compound"("groupId", "updatedAt");
