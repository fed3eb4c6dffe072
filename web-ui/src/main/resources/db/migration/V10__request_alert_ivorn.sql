-- A request made from a VOEvent alert keeps the packet's IVORN, so that the same packet sent again (a broker that
-- reconnects, two brokers relaying one alert) finds the request it made instead of making another. Unique: two
-- packets arriving at once cannot both store one. Null for every other request (a unique index admits many nulls).
alter table observing_request add column alert_ivorn varchar(500);
create unique index observing_request_alert_ivorn on observing_request (alert_ivorn);
