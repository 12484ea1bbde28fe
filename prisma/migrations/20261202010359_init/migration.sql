-- CreateEnum
CREATE TYPE "Role" AS ENUM ('lead', 'member', 'viewer');

-- CreateEnum
CREATE TYPE "ComponentRole" AS ENUM ('product', 'starting_material', 'reagent', 'byproduct', 'impurity', 'catalyst', 'other');

-- CreateEnum
CREATE TYPE "PurityMethod" AS ENUM ('qnmr', 'hplc', 'gc', 'weight_only');

-- CreateEnum
CREATE TYPE "OutcomeStatus" AS ENUM ('as_expected', 'below', 'above', 'unknown');

-- CreateEnum
CREATE TYPE "ObservationKind" AS ENUM ('measured', 'inferred');

-- CreateEnum
CREATE TYPE "ObservationBound" AS ENUM ('value', 'lower', 'upper');

-- CreateEnum
CREATE TYPE "JobStatus" AS ENUM ('queued', 'running', 'done', 'failed');

-- CreateTable
CREATE TABLE "Group" (
    "id" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "slug" TEXT NOT NULL,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "Group_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "User" (
    "id" TEXT NOT NULL,
    "email" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "passwordHash" TEXT,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "User_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Membership" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "userId" TEXT NOT NULL,
    "role" "Role" NOT NULL,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "Membership_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Invite" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "tokenHash" TEXT NOT NULL,
    "role" "Role" NOT NULL,
    "createdById" TEXT NOT NULL,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "expiresAt" TIMESTAMP(3) NOT NULL,
    "usedAt" TIMESTAMP(3),
    "usedById" TEXT,

    CONSTRAINT "Invite_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "SignInAttempt" (
    "id" TEXT NOT NULL,
    "key" TEXT NOT NULL,
    "succeeded" BOOLEAN NOT NULL,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "SignInAttempt_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "ApiToken" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "userId" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "prefix" TEXT NOT NULL,
    "tokenHash" TEXT NOT NULL,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "lastUsedAt" TIMESTAMP(3),
    "revokedAt" TIMESTAMP(3),

    CONSTRAINT "ApiToken_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Compound" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "synonyms" TEXT[],
    "tags" TEXT[],
    "canonicalSmiles" TEXT NOT NULL,
    "molfile" TEXT,
    "formula" TEXT NOT NULL,
    "molarMass" DOUBLE PRECISION NOT NULL,
    "crippenLogP" DOUBLE PRECISION,
    "tpsa" DOUBLE PRECISION,
    "logP" DOUBLE PRECISION,
    "logPSource" TEXT,
    "pKas" JSONB NOT NULL DEFAULT '[]',
    "fingerprint" BYTEA,
    "notes" TEXT NOT NULL DEFAULT '',
    "createdById" TEXT,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Compound_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Solvent" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "key" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "props" JSONB NOT NULL,
    "builtin" BOOLEAN NOT NULL DEFAULT true,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Solvent_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "AqueousReagent" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "key" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "props" JSONB NOT NULL,
    "builtin" BOOLEAN NOT NULL DEFAULT true,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "AqueousReagent_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Workup" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "title" TEXT NOT NULL,
    "performedOn" TIMESTAMP(3) NOT NULL,
    "chemistId" TEXT,
    "notebookRef" TEXT NOT NULL DEFAULT '',
    "scaleMmol" DOUBLE PRECISION,
    "expectedProductMmol" DOUBLE PRECISION,
    "assayedProductMmol" DOUBLE PRECISION,
    "spec" JSONB NOT NULL,
    "version" INTEGER NOT NULL DEFAULT 1,
    "searchText" TEXT NOT NULL DEFAULT '',
    "flagged" BOOLEAN NOT NULL DEFAULT false,
    "deviationPct" DOUBLE PRECISION,
    "status" "OutcomeStatus" NOT NULL DEFAULT 'unknown',
    "createdById" TEXT,
    "updatedById" TEXT,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Workup_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "WorkupComponent" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "workupId" TEXT NOT NULL,
    "compoundId" TEXT,
    "key" TEXT NOT NULL,
    "name" TEXT NOT NULL,
    "role" "ComponentRole" NOT NULL,
    "amountMmol" DOUBLE PRECISION NOT NULL,

    CONSTRAINT "WorkupComponent_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "WorkupVersion" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "workupId" TEXT NOT NULL,
    "version" INTEGER NOT NULL,
    "snapshot" JSONB NOT NULL,
    "editedById" TEXT,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "WorkupVersion_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Outcome" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "workupId" TEXT NOT NULL,
    "isolatedMassMg" DOUBLE PRECISION NOT NULL,
    "purityPct" DOUBLE PRECISION,
    "purityMethod" "PurityMethod" NOT NULL,
    "layerAssays" JSONB NOT NULL DEFAULT '[]',
    "recoveryPct" DOUBLE PRECISION,
    "notes" TEXT NOT NULL DEFAULT '',
    "reportedById" TEXT,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Outcome_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Prediction" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "workupId" TEXT NOT NULL,
    "workupVersion" INTEGER NOT NULL,
    "engineVersion" TEXT NOT NULL,
    "result" JSONB NOT NULL,
    "productRecovery" DOUBLE PRECISION,
    "recoveryLow" DOUBLE PRECISION,
    "recoveryHigh" DOUBLE PRECISION,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "Prediction_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "PartitionObservation" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "compoundId" TEXT NOT NULL,
    "solventKey" TEXT NOT NULL,
    "aqueousPh" DOUBLE PRECISION,
    "temperatureC" DOUBLE PRECISION NOT NULL DEFAULT 25,
    "logK" DOUBLE PRECISION NOT NULL,
    "logKSe" DOUBLE PRECISION,
    "kind" "ObservationKind" NOT NULL,
    "bound" "ObservationBound" NOT NULL DEFAULT 'value',
    "method" TEXT NOT NULL,
    "weight" DOUBLE PRECISION NOT NULL DEFAULT 1,
    "excluded" BOOLEAN NOT NULL DEFAULT false,
    "workupId" TEXT,
    "details" JSONB NOT NULL DEFAULT '{}',
    "createdById" TEXT,
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "PartitionObservation_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "AuditEvent" (
    "id" TEXT NOT NULL,
    "groupId" TEXT,
    "actorId" TEXT,
    "action" TEXT NOT NULL,
    "entity" TEXT NOT NULL,
    "entityId" TEXT,
    "details" JSONB NOT NULL DEFAULT '{}',
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,

    CONSTRAINT "AuditEvent_pkey" PRIMARY KEY ("id")
);

-- CreateTable
CREATE TABLE "Job" (
    "id" TEXT NOT NULL,
    "groupId" TEXT NOT NULL,
    "kind" TEXT NOT NULL,
    "status" "JobStatus" NOT NULL DEFAULT 'queued',
    "total" INTEGER NOT NULL DEFAULT 0,
    "done" INTEGER NOT NULL DEFAULT 0,
    "payload" JSONB NOT NULL DEFAULT '{}',
    "error" TEXT,
    "lockedBy" TEXT,
    "lockedAt" TIMESTAMP(3),
    "createdAt" TIMESTAMP(3) NOT NULL DEFAULT CURRENT_TIMESTAMP,
    "updatedAt" TIMESTAMP(3) NOT NULL,

    CONSTRAINT "Job_pkey" PRIMARY KEY ("id")
);

-- CreateIndex
CREATE UNIQUE INDEX "Group_slug_key" ON "Group"("slug");

-- CreateIndex
CREATE UNIQUE INDEX "User_email_key" ON "User"("email");

-- CreateIndex
CREATE INDEX "Membership_userId_idx" ON "Membership"("userId");

-- CreateIndex
CREATE UNIQUE INDEX "Membership_groupId_userId_key" ON "Membership"("groupId", "userId");

-- CreateIndex
CREATE UNIQUE INDEX "Invite_tokenHash_key" ON "Invite"("tokenHash");

-- CreateIndex
CREATE INDEX "Invite_groupId_idx" ON "Invite"("groupId");

-- CreateIndex
CREATE INDEX "SignInAttempt_key_createdAt_idx" ON "SignInAttempt"("key", "createdAt");

-- CreateIndex
CREATE UNIQUE INDEX "ApiToken_tokenHash_key" ON "ApiToken"("tokenHash");

-- CreateIndex
CREATE INDEX "ApiToken_userId_idx" ON "ApiToken"("userId");

-- CreateIndex
CREATE INDEX "Compound_groupId_name_idx" ON "Compound"("groupId", "name");

-- CreateIndex
CREATE UNIQUE INDEX "Compound_groupId_canonicalSmiles_key" ON "Compound"("groupId", "canonicalSmiles");

-- CreateIndex
CREATE UNIQUE INDEX "Solvent_groupId_key_key" ON "Solvent"("groupId", "key");

-- CreateIndex
CREATE UNIQUE INDEX "AqueousReagent_groupId_key_key" ON "AqueousReagent"("groupId", "key");

-- CreateIndex
CREATE INDEX "Workup_groupId_performedOn_id_idx" ON "Workup"("groupId", "performedOn" DESC, "id");

-- CreateIndex
CREATE INDEX "Workup_groupId_chemistId_idx" ON "Workup"("groupId", "chemistId");

-- CreateIndex
CREATE INDEX "Workup_groupId_flagged_idx" ON "Workup"("groupId", "flagged");

-- CreateIndex
CREATE INDEX "WorkupComponent_groupId_compoundId_idx" ON "WorkupComponent"("groupId", "compoundId");

-- CreateIndex
CREATE INDEX "WorkupComponent_workupId_idx" ON "WorkupComponent"("workupId");

-- CreateIndex
CREATE UNIQUE INDEX "WorkupVersion_workupId_version_key" ON "WorkupVersion"("workupId", "version");

-- CreateIndex
CREATE UNIQUE INDEX "Outcome_workupId_key" ON "Outcome"("workupId");

-- CreateIndex
CREATE INDEX "Prediction_workupId_createdAt_idx" ON "Prediction"("workupId", "createdAt");

-- CreateIndex
CREATE INDEX "PartitionObservation_groupId_compoundId_solventKey_idx" ON "PartitionObservation"("groupId", "compoundId", "solventKey");

-- CreateIndex
CREATE INDEX "AuditEvent_groupId_createdAt_idx" ON "AuditEvent"("groupId", "createdAt");

-- CreateIndex
CREATE INDEX "Job_status_createdAt_idx" ON "Job"("status", "createdAt");

-- AddForeignKey
ALTER TABLE "Membership" ADD CONSTRAINT "Membership_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Membership" ADD CONSTRAINT "Membership_userId_fkey" FOREIGN KEY ("userId") REFERENCES "User"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Invite" ADD CONSTRAINT "Invite_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "ApiToken" ADD CONSTRAINT "ApiToken_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "ApiToken" ADD CONSTRAINT "ApiToken_userId_fkey" FOREIGN KEY ("userId") REFERENCES "User"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Compound" ADD CONSTRAINT "Compound_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Solvent" ADD CONSTRAINT "Solvent_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AqueousReagent" ADD CONSTRAINT "AqueousReagent_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Workup" ADD CONSTRAINT "Workup_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "WorkupComponent" ADD CONSTRAINT "WorkupComponent_workupId_fkey" FOREIGN KEY ("workupId") REFERENCES "Workup"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "WorkupComponent" ADD CONSTRAINT "WorkupComponent_compoundId_fkey" FOREIGN KEY ("compoundId") REFERENCES "Compound"("id") ON DELETE SET NULL ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "WorkupVersion" ADD CONSTRAINT "WorkupVersion_workupId_fkey" FOREIGN KEY ("workupId") REFERENCES "Workup"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Outcome" ADD CONSTRAINT "Outcome_workupId_fkey" FOREIGN KEY ("workupId") REFERENCES "Workup"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Prediction" ADD CONSTRAINT "Prediction_workupId_fkey" FOREIGN KEY ("workupId") REFERENCES "Workup"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "PartitionObservation" ADD CONSTRAINT "PartitionObservation_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "PartitionObservation" ADD CONSTRAINT "PartitionObservation_compoundId_fkey" FOREIGN KEY ("compoundId") REFERENCES "Compound"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "AuditEvent" ADD CONSTRAINT "AuditEvent_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;

-- AddForeignKey
ALTER TABLE "Job" ADD CONSTRAINT "Job_groupId_fkey" FOREIGN KEY ("groupId") REFERENCES "Group"("id") ON DELETE CASCADE ON UPDATE CASCADE;
