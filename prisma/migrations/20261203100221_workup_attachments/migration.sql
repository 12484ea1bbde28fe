-- CreateEnum
CREATE TYPE "AttachmentTarget" AS ENUM ('workup', 'outcome');

-- CreateTable
CREATE TABLE "Attachment" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "workupId" TEXT NOT NULL,
    "target" "AttachmentTarget" NOT NULL DEFAULT 'workup',
    "fileName" TEXT NOT NULL,
    "mediaType" TEXT NOT NULL,
    "sizeBytes" INTEGER NOT NULL,
    "sha256" TEXT NOT NULL,
    "data" BYTEA NOT NULL,
    "thumbnail" BYTEA,
    "createdById" TEXT,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "Attachment_pkey" PRIMARY KEY ("id")
);

-- CreateIndex
CREATE INDEX "Attachment_groupId_workupId_createdAt_idx" ON "Attachment"("groupId", "workupId", "createdAt");

-- AddForeignKey
ALTER TABLE "Attachment" ADD CONSTRAINT "Attachment_workupId_fkey" FOREIGN KEY ("workupId") REFERENCES "Workup"("id") ON DELETE CASCADE ON UPDATE CASCADE;
