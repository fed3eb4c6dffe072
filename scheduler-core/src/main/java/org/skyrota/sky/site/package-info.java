/** Sites (location, time zone, horizon profile, sky and air) and the nights they define. */
package org.skyrota.sky.site;
