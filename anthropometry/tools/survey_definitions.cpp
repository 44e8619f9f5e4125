// SPDX-License-Identifier: MIT
#include "survey_definitions.hpp"

namespace rackreach {
namespace {

// Definitions are paraphrased from the survey documentation as quoted with the raw files; those marked
// "(from memory)" there are marked the same way here until checked against the measurers' handbooks.
const std::vector<std::string> common_method = {
    "Percentile of one sex: Hyndman & Fan (1996) type 7, the default of R quantile and numpy.percentile: sort "
    "x[0..n-1], h = (n-1)p, i = floor(h), Q = x[i] + (h-i)(x[i+1]-x[i]).",
    "mean: arithmetic mean; sd: sample standard deviation (divisor n-1).",
    "Derived dimensions are computed subject by subject from the measured columns and then summarised; they are "
    "never sums of percentiles.",
    "A subject with the missing-value code -999 in a column is left out of every dimension that uses it (n shows "
    "it).",
    "Tabulated every 0.1 percentile below the 5th and above the 95th and every 0.25 percentile between; the "
    "quantile function is taken as linear between tabulated percentiles.",
    "Mixture of the sexes (computed by the program, not stored): with F_s the inverse of sex s's tabulated "
    "quantile function and w_s its share, the p-th percentile of the workforce is min{x : sum_s w_s F_s(x) >= "
    "p}; mean = sum w_s m_s; sd = sqrt(sum w_s (s_s^2 + (m_s - mean)^2)).",
    "Values are body dimensions without shoes or clothing allowances."};

std::function<double(const std::vector<double>&)> difference_of_differences() {
  // a - (b - (c - d))
  return [](const std::vector<double>& v) { return v[0] - (v[1] - (v[2] - v[3])); };
}

SurveyDefinition make_ansur2() {
  SurveyDefinition s;
  s.name = "ansur2";
  s.title = "U.S. Army Anthropometric Survey 2012 (ANSUR II), public data";
  s.citation =
      "Gordon, C.C., Blackwell, C.L., Bradtmiller, B., Parham, J.L., Barrientos, P., Paquette, S.P., Corner, B.D., "
      "Carson, J.M., Venezia, J.C., Rockwell, B.M., Mucher, M., Kristensen, S. (2014). 2012 Anthropometric Survey "
      "of U.S. Army Personnel: Methods and Summary Statistics. Technical Report NATICK/TR-15/007, U.S. Army Natick "
      "Soldier Research, Development and Engineering Center, Natick, MA. Public working-database files "
      "ANSUR_II_FEMALE_Public.csv and ANSUR_II_MALE_Public.csv.";
  s.survey =
      "1,986 women and 4,082 men of the U.S. Army, measured October 2010 to April 2012; every subject counts once "
      "(the survey's own statistics are weighted to the Army's make-up, these are not).";
  s.delimiter = ',';
  s.files = {{"ANSUR_II_FEMALE_Public.csv", Sex::female, 1986, "Gender", "Female"},
             {"ANSUR_II_MALE_Public.csv", Sex::male, 4082, "Gender", "Male"}};
  s.method = common_method;
  s.caveats = {
      "Military sample aged 17 to 58; civilian U.S. adults are a little shorter, notably the women (NHANES "
      "2021-2023 adult stature 5th/50th/95th: women 149.6/161.2/172.5 cm, men 162.2/175.2/187.2 cm).",
      "Reaches are maximal static reaches without a load; working reach is shorter.",
      "Derived dimensions combine measurements taken in different postures and carry a few millimetres to a few "
      "centimetres of posture error."};
  const std::string grip_axis = "(handlength - (forearmhandlength - forearmcenterofgriplength))";
  s.dimensions = {
      {"stature",
       "Stature",
       TableUnit::mm,
       DimensionKind::measured,
       "Floor to the top of the head, standing erect.",
       {"stature"},
       "",
       "",
       {}},
      {"acromial_height",
       "Shoulder (acromial) height",
       TableUnit::mm,
       DimensionKind::measured,
       "Floor to the acromion (bony tip of the shoulder), standing, arms hanging (from memory).",
       {"acromialheight"},
       "",
       "",
       {}},
      {"wrist_height",
       "Wrist height",
       TableUnit::mm,
       DimensionKind::measured,
       "Floor to stylion (lower tip of the radius at the wrist), standing, arms hanging (from memory).",
       {"wristheight"},
       "",
       "",
       {}},
      {"thumb_tip_reach",
       "Thumb-tip reach",
       TableUnit::mm,
       DimensionKind::measured,
       "Wall to the tip of the thumb, standing with the back against the wall, arm straight forward at shoulder "
       "level, thumb tip pressed to the index finger (from memory).",
       {"thumbtipreach"},
       "",
       "",
       {}},
      {"biacromial_breadth",
       "Shoulder breadth (biacromial)",
       TableUnit::mm,
       DimensionKind::measured,
       "Between the right and left acromion landmarks, beam caliper (from memory).",
       {"biacromialbreadth"},
       "",
       "",
       {}},
      {"bideltoid_breadth",
       "Shoulder breadth (bideltoid)",
       TableUnit::mm,
       DimensionKind::measured,
       "Maximum horizontal breadth over the deltoid muscles (from memory).",
       {"bideltoidbreadth"},
       "",
       "",
       {}},
      {"hand_length",
       "Hand length",
       TableUnit::mm,
       DimensionKind::measured,
       "Stylion (wrist) to the tip of the middle finger.",
       {"handlength"},
       "",
       "",
       {}},
      {"hand_breadth",
       "Hand breadth",
       TableUnit::mm,
       DimensionKind::measured,
       "Breadth of the hand across the metacarpals (knuckles) (from memory).",
       {"handbreadth"},
       "",
       "",
       {}},
      {"body_mass",
       "Body mass",
       TableUnit::kg,
       DimensionKind::measured,
       "Body mass.",
       {"weightkg"},
       "",
       "The file stores 0.1 kg.",
       {},
       0.1},
      {"chest_depth",
       "Chest depth",
       TableUnit::mm,
       DimensionKind::measured,
       "Horizontal depth of the trunk at the chest, standing (from memory).",
       {"chestdepth"},
       "",
       "",
       {}},
      {"waist_depth",
       "Waist depth",
       TableUnit::mm,
       DimensionKind::measured,
       "Horizontal depth of the trunk at the waist, standing (from memory).",
       {"waistdepth"},
       "",
       "",
       {}},
      {"abdominal_extension_depth_sitting",
       "Abdominal extension depth, sitting",
       TableUnit::mm,
       DimensionKind::measured,
       "Maximum horizontal depth of the abdomen, seated (from memory).",
       {"abdominalextensiondepthsitting"},
       "",
       "",
       {}},
      {"grip_centre_height",
       "Grip-centre height, arm hanging",
       TableUnit::mm,
       DimensionKind::derived,
       "Floor to the axis of a rod gripped in the fist, standing, arm hanging: the floor of the waist zone "
       "(knuckle height was not measured).",
       {"wristheight", "handlength", "forearmhandlength", "forearmcenterofgriplength"},
       "wristheight - " + grip_axis +
           ": wrist height less the stylion-to-grip-axis length, itself hand length less the fingertip-to-grip-axis "
           "length (forearm-hand length less forearm-to-grip-centre length)",
       "Against the ansur1988 table's direct route (wrist height - wrist-to-grip-centre length) this runs about "
       "1 cm higher throughout (women mean 735 vs 724 mm, 5th percentile 674 vs 665 mm).",
       difference_of_differences()},
      {"elbow_height",
       "Elbow height, arm hanging",
       TableUnit::mm,
       DimensionKind::derived,
       "Floor to the underside of the elbow flexed 90 degrees, upper arm hanging (standing elbow height was not "
       "measured).",
       {"acromialheight", "shoulderelbowlength"},
       "acromialheight - shoulderelbowlength (shoulder-elbow length: acromion to the underside of the flexed "
       "elbow)",
       "",
       [](const std::vector<double>& v) { return v[0] - v[1]; }},
      {"overhead_grip_reach",
       "Overhead grip reach, standing (estimate)",
       TableUnit::mm,
       DimensionKind::derived,
       "Floor to the axis of a rod gripped in the fist, standing, arm raised straight up. ANSUR II measured "
       "overhead reach only seated, so this is an estimate.",
       {"stature", "overheadfingertipreachsitting", "sittingheight", "forearmhandlength", "forearmcenterofgriplength"},
       "stature + overheadfingertipreachsitting - sittingheight - (forearmhandlength - "
       "forearmcenterofgriplength): the seated overhead fingertip reach carried to standing by the difference of "
       "stature and sitting height, less the fingertip-to-grip-axis length",
       "Prefer the ansur1988 table, which measured overhead reach standing (Rackreach does so for the shipped "
       "tables). On the 1988 subjects, measured both ways, this seated route overstates the standing fingertip "
       "reach by 42 +/- 22 mm (women) and 44 +/- 23 mm (men). Against the 1988 measured grip reach: 5th "
       "percentile women 1810.2 vs 1810.7 mm, 95th percentile men 2300.0 vs 2257.0 mm; the gap is not a "
       "constant offset.",
       [](const std::vector<double>& v) { return v[0] + v[1] - v[2] - (v[3] - v[4]); }},
      {"shoulder_grip_length",
       "Forward grip reach from the shoulder",
       TableUnit::mm,
       DimensionKind::derived,
       "Acromion to the axis of a rod gripped in the fist, arm and wrist straight: the radius of grip reach about "
       "the shoulder.",
       {"acromionradialelength", "radialestylionlength", "handlength", "forearmhandlength",
        "forearmcenterofgriplength"},
       "acromionradialelength + radialestylionlength + " + grip_axis +
           ": upper-arm link, forearm link and stylion-to-grip-axis length",
       "Link lengths measured with the arm hanging; no shoulder protraction or trunk lean is included.",
       [](const std::vector<double>& v) { return v[0] + v[1] + (v[2] - (v[3] - v[4])); }},
  };
  return s;
}

SurveyDefinition make_ansur1988() {
  SurveyDefinition s;
  s.name = "ansur1988";
  s.title = "U.S. Army Anthropometric Survey 1988 (ANSUR)";
  s.citation =
      "Gordon, C.C., Churchill, T., Clauser, C.E., Bradtmiller, B., McConville, J.T., Tebbetts, I., Walker, R.A. "
      "(1989). 1988 Anthropometric Survey of U.S. Army Personnel: Methods and Summary Statistics. Technical Report "
      "NATICK/TR-89/044, U.S. Army Natick Research, Development and Engineering Center, Natick, MA (authors after "
      "the first from memory). Raw files ansur_women.txt and ansur_men.txt.";
  s.survey =
      "2,208 women and 1,774 men of the U.S. Army, measured August 1987 to July 1988; every subject counts once.";
  s.delimiter = '\t';
  s.files = {{"ansur_women.txt", Sex::female, 2208, "GENDER", "2"}, {"ansur_men.txt", Sex::male, 1774, "GENDER", "1"}};
  s.method = common_method;
  s.caveats = {
      "Measured 1987-1988: lengths and heights have hardly changed in the Army since, body mass has (median "
      "61.3 kg women, 77.7 kg men here against 66.8 and 84.6 kg in ANSUR II): take mass, girths and depths from "
      "ansur2.",
      "Military sample aged 17 to 51; civilian women are shorter.",
      "Overhead reach is taken facing a wall, both arms up, toes 20 cm from the wall; a load or a shelf edge "
      "further from the feet lowers what can be reached.",
      "Reaches are maximal static reaches without a load; working reach is shorter."};
  const std::string grip_axis = "(HAND_LNTH - WRIST_TO_CENTER_OF_GRIP_LNTH)";
  s.dimensions = {
      {"stature",
       "Stature",
       TableUnit::mm,
       DimensionKind::measured,
       "Floor to the top of the head, standing erect, head in the Frankfort plane, heels together.",
       {"STATURE"},
       "",
       "",
       {}},
      {"acromial_height",
       "Shoulder (acromial) height",
       TableUnit::mm,
       DimensionKind::measured,
       "Floor to the acromion (bony tip of the shoulder), standing, arms hanging (from memory).",
       {"ACROMION_HT"},
       "",
       "",
       {}},
      {"wrist_height",
       "Wrist height",
       TableUnit::mm,
       DimensionKind::measured,
       "Floor to stylion (lower tip of the radius at the wrist), standing, arms hanging (from memory).",
       {"WRIST_HT"},
       "",
       "",
       {}},
      {"thumb_tip_reach",
       "Thumb-tip reach",
       TableUnit::mm,
       DimensionKind::measured,
       "Wall to the tip of the thumb, back against the wall, arm straight forward at shoulder level, thumb pressed "
       "to the index finger (from memory).",
       {"THUMB-TIP_REACH"},
       "",
       "",
       {}},
      {"biacromial_breadth",
       "Shoulder breadth (biacromial)",
       TableUnit::mm,
       DimensionKind::measured,
       "Between the right and left acromion landmarks, beam caliper, seated.",
       {"BIACROMIAL_BRTH"},
       "",
       "",
       {}},
      {"bideltoid_breadth",
       "Shoulder breadth (bideltoid)",
       TableUnit::mm,
       DimensionKind::measured,
       "Maximum horizontal breadth over the deltoid muscles, seated.",
       {"BIDELTOID_BRTH"},
       "",
       "",
       {}},
      {"hand_length",
       "Hand length",
       TableUnit::mm,
       DimensionKind::measured,
       "Stylion to the tip of the middle finger, hand flat on a table.",
       {"HAND_LNTH"},
       "",
       "",
       {}},
      {"hand_breadth",
       "Hand breadth",
       TableUnit::mm,
       DimensionKind::measured,
       "Breadth of the hand across the metacarpals (knuckles) (from memory).",
       {"HAND_BRTH_AT_METACARPALE"},
       "",
       "",
       {}},
      {"body_mass",
       "Body mass",
       TableUnit::kg,
       DimensionKind::measured,
       "Body mass.",
       {"WEIGHT"},
       "",
       "The file stores 0.1 kg. Outdated for a present-day workforce: see the caveats.",
       {},
       0.1},
      {"chest_depth",
       "Chest depth",
       TableUnit::mm,
       DimensionKind::measured,
       "Horizontal depth of the trunk at the chest, standing (from memory).",
       {"CHEST_DEPTH"},
       "",
       "",
       {}},
      {"waist_depth",
       "Waist depth (omphalion)",
       TableUnit::mm,
       DimensionKind::measured,
       "Horizontal depth of the trunk at the navel, standing (from memory).",
       {"WAIST_DEPTH-OMPHALION"},
       "",
       "",
       {}},
      {"abdominal_extension_depth_sitting",
       "Abdominal extension depth, sitting",
       TableUnit::mm,
       DimensionKind::measured,
       "Maximum horizontal depth of the abdomen, seated (from memory).",
       {"AB-EXT-DEPTH-SIT"},
       "",
       "",
       {}},
      {"grip_centre_height",
       "Grip-centre height, arm hanging",
       TableUnit::mm,
       DimensionKind::derived,
       "Floor to the axis of a rod gripped in the fist, standing, arm hanging: the floor of the waist zone "
       "(knuckle height was not measured).",
       {"WRIST_HT", "WRIST_TO_CENTER_OF_GRIP_LNTH"},
       "WRIST_HT - WRIST_TO_CENTER_OF_GRIP_LNTH",
       "",
       [](const std::vector<double>& v) { return v[0] - v[1]; }},
      {"elbow_height",
       "Elbow height, arm hanging",
       TableUnit::mm,
       DimensionKind::derived,
       "Floor to the underside of the elbow flexed 90 degrees, upper arm hanging (standing elbow height was not "
       "measured).",
       {"ACROMION_HT", "SHOULDER_ELBOW_LNTH"},
       "ACROMION_HT - SHOULDER_ELBOW_LNTH",
       "",
       [](const std::vector<double>& v) { return v[0] - v[1]; }},
      {"overhead_grip_reach",
       "Overhead grip reach, standing",
       TableUnit::mm,
       DimensionKind::derived,
       "Floor to the axis of a rod gripped in the fist, standing, arm raised straight up: from the measured "
       "standing overhead fingertip reach.",
       {"OVRHD_REACH", "HAND_LNTH", "WRIST_TO_CENTER_OF_GRIP_LNTH"},
       "OVRHD_REACH - " + grip_axis +
           ": measured standing overhead fingertip reach less the fingertip-to-grip-axis length",
       "Preferred over the ansur2 estimate, which starts from a seated measurement (see that table).",
       [](const std::vector<double>& v) { return v[0] - (v[1] - v[2]); }},
      {"overhead_fingertip_reach",
       "Overhead fingertip reach, standing",
       TableUnit::mm,
       DimensionKind::measured,
       "Floor to the tip of the right middle finger, standing facing a wall, both arms stretched overhead, palms "
       "on the wall, toes 20 cm from the wall, feet about 10 cm apart.",
       {"OVRHD_REACH"},
       "",
       "",
       {}},
      {"shoulder_grip_length",
       "Forward grip reach from the shoulder",
       TableUnit::mm,
       DimensionKind::derived,
       "Acromion to the axis of a rod gripped in the fist, arm and wrist straight: the radius of grip reach about "
       "the shoulder.",
       {"ACR-RADL_LNTH", "RADIALE-STYLION_LNTH", "WRIST_TO_CENTER_OF_GRIP_LNTH"},
       "ACR-RADL_LNTH + RADIALE-STYLION_LNTH + WRIST_TO_CENTER_OF_GRIP_LNTH: upper-arm link, forearm link and "
       "wrist-to-grip-centre length",
       "Link lengths measured with the arm hanging; no shoulder protraction or trunk lean is included.",
       [](const std::vector<double>& v) { return v[0] + v[1] + v[2]; }},
      {"forward_grip_reach_from_wall",
       "Forward grip reach from a wall",
       TableUnit::mm,
       DimensionKind::derived,
       "Wall to the axis of a rod gripped in the fist, back against the wall, arm straight forward at shoulder "
       "level.",
       {"WRST_LNTH_TO_WALL", "WRIST_TO_CENTER_OF_GRIP_LNTH"},
       "WRST_LNTH_TO_WALL + WRIST_TO_CENTER_OF_GRIP_LNTH",
       "",
       [](const std::vector<double>& v) { return v[0] + v[1]; }},
  };
  return s;
}

}  // namespace

const SurveyDefinition* find_survey(std::string_view name) {
  // Immutable after first use.
  static const SurveyDefinition ansur2 = make_ansur2();
  static const SurveyDefinition ansur1988 = make_ansur1988();
  if (name == "ansur2") return &ansur2;
  if (name == "ansur1988") return &ansur1988;
  return nullptr;
}

}  // namespace rackreach
