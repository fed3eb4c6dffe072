-- A request's target may be of a plugin's kind (a planet, a comet): the kind, and its parameters by name.
-- Existing requests are fixed ICRS targets. For another kind ra_deg and dec_deg hold 0 and are not used.
alter table observing_request add column target_kind varchar(40) default 'fixed' not null;

create table request_target_parameter (
    request_id   bigint        not null references observing_request (id) on delete cascade,
    param_name   varchar(40)   not null,
    param_value  varchar(200)  not null,
    primary key (request_id, param_name)
);
