/**
 * The plugin interfaces that need no solver types. A plugin is a plain jar whose classes are
 * listed under {@code META-INF/services/} for one or more of {@link org.skyrota.plugin.TargetKind},
 * {@link org.skyrota.plugin.RequestImporter}, {@link org.skyrota.plugin.PlanExporter} and
 * {@link org.skyrota.plugin.ConditionsFeed}, and found with {@link java.util.ServiceLoader}.
 * The score-rule interface lives in the constraints module because it needs OptaPlanner types.
 *
 * <p>These interfaces speak in small records of their own ({@link org.skyrota.plugin.RequestRecord},
 * {@link org.skyrota.plugin.PlannedVisitRecord}, {@link org.skyrota.plugin.SiteCondition}) rather than
 * the planner's internal model, so that a plugin built for {@link org.skyrota.plugin.PluginApi#VERSION}
 * keeps working while the planner changes.
 */
package org.skyrota.plugin;
