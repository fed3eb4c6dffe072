-- Repeats can ask for a least spacing between visits (start to start) and a tolerance that loosens it, in hours.
-- Null where none was asked: requests stored before these columns existed keep planning as they did.
alter table observing_request add column repeat_interval_hours double precision;
alter table observing_request add column repeat_tolerance_hours double precision;
