-- Every commit that moves a session's log on tells the processes listening on
-- "contend_events" (several servers on one PostgreSQL) which session and up to which seq, so
-- each reads the new events and pushes its own sockets. NOTIFY is delivered at commit only,
-- so a listener never hears of events it cannot read yet. Not in schema.prisma: Prisma does
-- not model triggers.
CREATE FUNCTION "contend_notify_event"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM pg_notify('contend_events', NEW."id" || ':' || NEW."lastSeq");
  RETURN NULL;
END;
$$;

CREATE TRIGGER "Session_notify_event"
  AFTER UPDATE OF "lastSeq" ON "Session"
  FOR EACH ROW WHEN (NEW."lastSeq" IS DISTINCT FROM OLD."lastSeq")
  EXECUTE FUNCTION "contend_notify_event"();
