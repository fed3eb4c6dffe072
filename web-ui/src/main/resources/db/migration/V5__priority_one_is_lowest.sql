-- Request priority used to be stored as 1 (highest) to 5 (lowest); it now runs from 1 (lowest) to 5 (highest), as
-- the planner and the import formats count. Flip the stored values so that every request keeps its meaning:
-- 1 becomes 5, 2 becomes 4, 3 stays 3. (Audit records keep the numbers as the API showed them at the time.)
update observing_request set priority = 6 - priority;
