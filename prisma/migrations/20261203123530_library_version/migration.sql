-- AlterTable
ALTER TABLE "Group" ADD COLUMN     "libraryVersion" INTEGER NOT NULL DEFAULT 0;

-- Every insert, update and delete of a group's library rows raises its stamp in the same transaction, whoever
-- writes them (the library editor, an import, the seed, another instance, or SQL by hand).
CREATE FUNCTION "raise_library_version"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  IF TG_OP <> 'INSERT' THEN
    UPDATE "Group" SET "libraryVersion" = "libraryVersion" + 1 WHERE "id" = OLD."groupId";
  END IF;
  IF TG_OP <> 'DELETE' AND (TG_OP = 'INSERT' OR NEW."groupId" IS DISTINCT FROM OLD."groupId") THEN
    UPDATE "Group" SET "libraryVersion" = "libraryVersion" + 1 WHERE "id" = NEW."groupId";
  END IF;
  RETURN NULL;
END;
$$;

CREATE TRIGGER "Solvent_raise_library_version" AFTER INSERT OR UPDATE OR DELETE ON "Solvent"
  FOR EACH ROW EXECUTE FUNCTION "raise_library_version"();
CREATE TRIGGER "AqueousReagent_raise_library_version" AFTER INSERT OR UPDATE OR DELETE ON "AqueousReagent"
  FOR EACH ROW EXECUTE FUNCTION "raise_library_version"();
