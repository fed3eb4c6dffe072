-- A term of operations, day after day.
-- Grants: for one telescope (as before), one site, or the whole network (both null).
alter table program_grant alter column telescope_id drop not null;
alter table program_grant add column site_id bigint references site (id);

-- Calendar sequence of a visit in a published revision (RFC 5545 SEQUENCE: it grows each time the visit changes),
-- and the visits of the last published plan that the new one gave up, kept so that calendars learn they are
-- cancelled (STATUS:CANCELLED, same UID, higher SEQUENCE).
alter table plan_visit add column sequence_no integer default 0 not null;
alter table plan_visit add column cancelled boolean default false not null;

-- What a finished run did, in numbers and plain words (JSON text), for its result and the run history.
alter table planner_run add column summary_json varchar;
alter table planner_run add column purpose varchar(200);
