/** The night almanac: the first sunset, dusks, dawns, sunrise, moonrise and moonset of each night. */
package org.skyrota.sky.almanac;
