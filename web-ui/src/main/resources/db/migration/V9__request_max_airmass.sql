-- A request may limit the airmass its target is observed through (Kasten-Young), beside the minimum altitude.
-- Null where no limit was asked: requests stored before this column existed keep planning as they did.
alter table observing_request add column max_airmass double precision;
