-- Custom SQL migration file, put your code below! ---- Newer lifters keep a ceiling of risk 2; every other level had no ceiling in the planner, so none is set.
UPDATE `athletes` SET `max_risk` = 2 WHERE `level` = 'novice';
