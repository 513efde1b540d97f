-- The police-notification clock of a private-property tow (Cal. Veh. Code § 22658, 1 hour from the call; Fla. Stat.
-- § 715.07(2)(a), 30 minutes from the arrival; both from memory and marked "M" in the samples) reached the shipped
-- sample rule sets after databases had loaded them, and a database keeps the sample version it loaded. This adds the
-- rule as a NEW version of each rule set derived from those samples whose latest version lacks it: the samples
-- themselves (by slug) and a company's copies still naming the sample's jurisdiction. A vehicle keeps the version it
-- arrived under, so no clock of a vehicle already on the lot changes; new tow-ins take the new version. Each copy's
-- new version is written in its company's settings record, by no person, with the reason. The rules below are the
-- samples' own `policeNotice`, word for word (tests/api/sample-police-notice.test.ts compares them).
WITH police(sample_slug, jurisdiction, rule) AS (
  VALUES
    ('california-sample', 'State of California, USA', '{"label": "Tell the local traffic law enforcement agency of the private-property tow", "hours": 1, "from": "tow-requested", "towReasons": ["private_property"], "source": {"citation": "Cal. Veh. Code § 22658: the local traffic law enforcement agency is told of a removal from private property within one hour after the tow is authorized.", "confidence": "M", "note": "From memory, not read in the current text: the section puts the call on the property owner or the towing company acting for them, within one hour of authorizing the tow; the hour here runs from the earliest time the tow-in records. Sample — verify with your local code and counsel."}}'::jsonb),
    ('florida-sample', 'State of Florida, USA', '{"label": "Tell the police or sheriff of the private-property tow", "hours": 0.5, "from": "tow-completed", "towReasons": ["private_property"], "source": {"citation": "Fla. Stat. § 715.07(2)(a): a towing company that removes a vehicle from private property notifies the municipal police department (in an unincorporated area, the sheriff) within 30 minutes after completing the tow, with the storage site, the time of the tow and the vehicle''s make, model, colour and plate.", "confidence": "M", "note": "From memory, not read in the current text. The duty is in § 715.07 (private-property towing); § 713.78 holds the lien and its notices. Sample — verify with your local code and counsel."}}'::jsonb)
),
latest AS (
  SELECT DISTINCT ON (v.rule_set_id) v.rule_set_id, v.version, v.body
  FROM rule_set_versions v
  ORDER BY v.rule_set_id, v.version DESC
),
targets AS (
  SELECT s.id AS rule_set_id, s.company_id, s.slug, s.name, l.version, l.body, p.rule
  FROM rule_sets s
  JOIN latest l ON l.rule_set_id = s.id
  JOIN police p ON (s.company_id IS NULL AND s.slug = p.sample_slug) OR (s.company_id IS NOT NULL AND l.body->>'jurisdiction' = p.jurisdiction)
  WHERE l.body->'policeNotice' IS NULL
),
added AS (
  INSERT INTO rule_set_versions (rule_set_id, version, body)
  SELECT rule_set_id, version + 1, body || jsonb_build_object('policeNotice', rule)
  FROM targets
  RETURNING rule_set_id, version
)
INSERT INTO settings_changes (company_id, actor_id, area, action, subject_id, subject_label, before, after, names, reason)
SELECT t.company_id, NULL, 'rule-set', 'saved', t.slug, t.name || ' (version ' || a.version || ')', '{}'::jsonb,
  jsonb_build_object(
    'policeNotice.label', t.rule->'label',
    'policeNotice.hours', t.rule->'hours',
    'policeNotice.from', t.rule->'from',
    'policeNotice.towReasons', t.rule->'towReasons',
    'policeNotice.source.citation', t.rule->'source'->'citation'
  ),
  '{}'::jsonb,
  'Holdfast added the police-notification rule of a private-property tow that the sample this rule set was copied from now has. Vehicles already on the lot keep the version they arrived under.'
FROM added a
JOIN targets t ON t.rule_set_id = a.rule_set_id
WHERE t.company_id IS NOT NULL;
