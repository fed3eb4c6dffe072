-- A telescope's mount: its kind, whether it must flip at the meridian (a German equatorial mount), and the hour
-- angles it reaches east and west (degrees; -180 and 180 mean no limit). Telescopes stored before these columns
-- existed become equatorial mounts without limits that never flip: they plan as they did.
alter table telescope add column mount_kind varchar(20) default 'EQUATORIAL' not null;
alter table telescope add column needs_meridian_flip boolean default false not null;
alter table telescope add column east_hour_angle_limit_deg double precision default -180 not null;
alter table telescope add column west_hour_angle_limit_deg double precision default 180 not null;
